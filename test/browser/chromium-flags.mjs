// How the browser tests and the viewer benchmark start Chromium: Debian's build, headless, with a fresh
// profile, talking to nothing on its own (no sync, no component updates, no background networking).
export const CHROMIUM = process.env.CHROMIUM ?? "/usr/bin/chromium";

export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];
