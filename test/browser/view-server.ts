import { type ChildProcess, spawn } from "node:child_process";
import { fileURLToPath } from "node:url";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

export interface RunningView {
  /** The address `view` printed, e.g. http://127.0.0.1:40123/ */
  url: string;
  process: ChildProcess;
  output: () => string;
  /** Sends Ctrl-C (SIGINT) and resolves with the exit code. */
  stop: () => Promise<number | null>;
}

/** Starts `cliquescape view ARGS` and waits (at most 60 s) for the address it prints. */
export function startView(args: string[], cwd?: string): Promise<RunningView> {
  const child = spawn(process.execPath, [BIN, "view", ...args], { cwd, stdio: ["ignore", "pipe", "pipe"] });
  let stdout = "";
  let stderr = "";
  child.stderr!.on("data", (chunk) => {
    stderr += chunk;
  });
  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      reject(new Error(`view printed no address in 60 s:\n${stdout}\n${stderr}`));
    }, 60_000);
    const early = (code: number | null) => {
      clearTimeout(timer);
      reject(new Error(`view exited (${code}) before serving:\n${stdout}\n${stderr}`));
    };
    child.once("exit", early);
    child.stdout!.on("data", (chunk) => {
      stdout += chunk;
      const match = /at (http:\/\/\S+\/)/.exec(stdout);
      if (!match) return;
      clearTimeout(timer);
      child.off("exit", early);
      resolve({
        url: match[1],
        process: child,
        output: () => stdout + stderr,
        stop: () => {
          child.kill("SIGINT");
          return exited;
        },
      });
    });
  });
}
