/** The tool version, written into every run spec and printed by --version. */
export const VERSION = "0.1.0";
