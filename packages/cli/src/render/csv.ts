/** One CSV document (RFC 4180): fields with commas, quotes or line breaks are quoted, quotes doubled. */
export function csvDocument(
  header: readonly string[],
  rows: readonly (readonly (string | number)[])[],
): string {
  return `${[header, ...rows].map((row) => row.map(csvField).join(",")).join("\n")}\n`;
}

function csvField(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}
