/** Saves text or bytes as a file through the browser's download. */
export function download(name: string, content: string | Blob, type = "text/plain"): void {
  const blob = typeof content === "string" ? new Blob([content], { type }) : content;
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = name;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** "ring01u" from "demo-data/graphs/ring01u.csv": a file-name stem for exports. */
export function exportStem(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? name;
  return (base.replace(/\.[^.]*$/, "") || "graph").replace(/[^A-Za-z0-9._-]+/g, "_");
}
