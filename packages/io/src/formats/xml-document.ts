import { DOMParser } from "@xmldom/xmldom";
import { InputFileError } from "../input-file-error.js";

/** The parsed document checkXml returns, for questions graphology's parsers do not answer. */
export type XmlDocument = ReturnType<DOMParser["parseFromString"]>;

/**
 * Checks that `text` is well-formed XML and returns the document, its root element's name and how many
 * elements of each `counted` tag it holds. A malformed document is an error at the parser's line and column, where
 * graphology's parsers would read a partial document without a word.
 */
export function checkXml(
  text: string,
  file: string,
  counted: readonly string[],
): { document: XmlDocument; root: string; counts: Record<string, number> } {
  let document: XmlDocument;
  // The parser wraps what onError throws; keep the first problem's own words.
  let problem: string | undefined;
  try {
    document = new DOMParser({
      onError: (level, message) => {
        if (level === "warning") return;
        problem ??= message;
        throw new Error(message);
      },
    }).parseFromString(text, "application/xml");
  } catch (error) {
    const locator = (error as { locator?: { lineNumber?: number; columnNumber?: number } }).locator;
    const line = locator?.lineNumber;
    const position = line !== undefined && line > 0 ? { line, column: locator?.columnNumber } : {};
    throw new InputFileError(
      file,
      "unreadable",
      `not well-formed XML: ${problem ?? (error as Error).message}`,
      position,
    );
  }
  const root = document.documentElement?.localName ?? "";
  const counts: Record<string, number> = {};
  for (const tag of counted) counts[tag] = document.getElementsByTagName(tag).length;
  return { document, root, counts };
}
