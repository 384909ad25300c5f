import { readFileSync } from "node:fs";
import { createRequire } from "node:module";

/** The built viewer page (one self-contained HTML file), or a message saying how to build it. */
export function viewerPageHtml(): string {
  let path: string;
  try {
    path = createRequire(import.meta.url).resolve("@cliquescape/viewer/page.html");
    return readFileSync(path, "utf8");
  } catch (error) {
    throw new Error(
      `the viewer page is not built (${(error as Error).message.split("\n")[0]}); run \`npm run build\` at the repository root`,
      { cause: error },
    );
  }
}
