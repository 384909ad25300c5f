import { defineConfig } from "vite";
import { viteSingleFile } from "vite-plugin-singlefile";

// One self-contained index.html: scripts, styles and the inlined worker. The CLI serves this file as it is
// (`cliquescape view`) and writes it with the run's data embedded (`cliquescape report`), so the page makes
// no network request beyond the data the server was given.
export default defineConfig({
  base: "./",
  plugins: [viteSingleFile()],
  // A classic worker: a module worker from a blob: URL does not load in a page opened from disk (origin null).
  worker: { format: "iife" },
  build: {
    outDir: "dist",
    emptyOutDir: true,
    target: "es2022",
    chunkSizeWarningLimit: 4000,
  },
});
