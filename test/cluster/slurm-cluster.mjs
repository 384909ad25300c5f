/**
 * A throwaway single-node Slurm cluster from Debian's packages (slurm-wlm, munge) for the cluster tests:
 * munged, slurmctld and slurmd run as root in the foreground, as children of the test process, with every
 * file (munge key, socket, slurm.conf, state, spool, logs) in one temporary folder and ports picked free.
 * proctrack/linuxproc and task/none need no cgroups. Every daemon started is stopped by stop(), and by an
 * exit hook should the test process end first; with CLIQUESCAPE_DAEMON_PIDS set (.ci/run sets it) their
 * ids are also listed in that file, so CI can stop strays.
 */
import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import {
  appendFileSync,
  chmodSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  openSync,
  readFileSync,
  writeFileSync,
} from "node:fs";
import { createServer } from "node:net";
import { hostname, tmpdir, totalmem } from "node:os";
import { join } from "node:path";

const PROGRAMS = ["munged", "slurmctld", "slurmd", "sbatch", "squeue", "scancel", "scontrol", "sinfo"];
const SEARCH = ["/usr/sbin", "/usr/bin", "/sbin", "/bin"];

/** @param {string} name @returns {string | null} */
function findProgram(name) {
  for (const dir of [...(process.env.PATH ?? "").split(":"), ...SEARCH]) {
    if (dir && existsSync(join(dir, name))) return join(dir, name);
  }
  return null;
}

/**
 * null when a cluster can be started here (root, and every program present); otherwise why not. Outside CI
 * the Slurm tests then skip with that reason in their name; under CI (.ci/run installs slurm-wlm and
 * munge and runs as root) it is a failure.
 */
/** @returns {string | null} */
export function missingSlurm() {
  const missing = PROGRAMS.filter((p) => findProgram(p) === null);
  const reason =
    missing.length > 0
      ? `no ${missing.join(", ")} (apt-get install -y slurm-wlm munge)`
      : process.getuid?.() !== 0
        ? "not root (the test cluster runs munged, slurmctld and slurmd as root)"
        : null;
  if (reason && process.env.CI)
    throw new Error(`${reason}; .ci/run provides it, so this is a CI setup fault`);
  return reason;
}

/**
 * @typedef {object} SlurmCluster
 * @property {NodeJS.ProcessEnv} env  for sbatch, squeue and the jobs: SLURM_CONF points at this cluster
 * @property {string} dir
 * @property {(program: string, args: string[]) => string} run  a Slurm client program against this cluster;
 *   throws with its stderr when it fails
 * @property {(ids: string[], timeoutMs: number) => Promise<void>} waitForJobs  until none of these jobs
 *   (array jobs included) is pending or running
 * @property {(id: string) => string} jobState  the final state of a job (COMPLETED, FAILED, CANCELLED…)
 * @property {() => string} logs  the daemons' log tails, for a failure message
 * @property {() => Promise<void>} stop
 */

/** @returns {Promise<number>} */
function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

const sleep = (/** @type {number} */ ms) => new Promise((resolve) => setTimeout(resolve, ms));

/** @returns {Promise<SlurmCluster>} */
export async function startSlurmCluster() {
  const dir = mkdtempSync(join(tmpdir(), "cliquescape-slurm-"));
  // munged insists that the socket's folder and its parents be reachable by all, and the key private.
  chmodSync(dir, 0o755);
  for (const sub of ["run", "state", "spool", "log"]) mkdirSync(join(dir, sub), { mode: 0o755 });
  mkdirSync(join(dir, "key"), { mode: 0o700 });
  const key = join(dir, "key", "munge.key");
  writeFileSync(key, randomBytes(1024), { mode: 0o600 });
  const socket = join(dir, "run", "munge.socket");
  const host = hostname().split(".")[0];
  const [ctldPort, slurmdPort] = [await freePort(), await freePort()];
  // Half the machine's memory: slurmd drains a node that claims more than it has.
  const realMemory = Math.max(512, Math.floor(totalmem() / 2 ** 20 / 2));
  const conf = join(dir, "slurm.conf");
  writeFileSync(
    conf,
    [
      "ClusterName=cliquescape-test",
      `SlurmctldHost=${host}`,
      `SlurmctldPort=${ctldPort}`,
      `SlurmdPort=${slurmdPort}`,
      "AuthType=auth/munge",
      `AuthInfo=socket=${socket}`,
      "CredType=cred/munge",
      "SlurmUser=root",
      "SlurmdUser=root",
      `StateSaveLocation=${join(dir, "state")}`,
      `SlurmdSpoolDir=${join(dir, "spool")}`,
      `SlurmctldPidFile=${join(dir, "run", "slurmctld.pid")}`,
      `SlurmdPidFile=${join(dir, "run", "slurmd.pid")}`,
      `SlurmctldLogFile=${join(dir, "log", "slurmctld.log")}`,
      `SlurmdLogFile=${join(dir, "log", "slurmd.log")}`,
      "ProctrackType=proctrack/linuxproc",
      "TaskPlugin=task/none",
      "JobAcctGatherType=jobacct_gather/none",
      "SwitchType=switch/none",
      "MpiDefault=none",
      "ReturnToService=2",
      "SelectType=select/cons_tres",
      "SelectTypeParameters=CR_CPU_Memory",
      // Finished jobs stay visible to scontrol for a while (the test reads their final state).
      "MinJobAge=600",
      `NodeName=${host} CPUs=2 RealMemory=${realMemory} State=UNKNOWN`,
      `PartitionName=test Nodes=${host} Default=YES MaxTime=INFINITE State=UP`,
      "",
    ].join("\n"),
  );
  const env = { ...process.env, SLURM_CONF: conf };
  /** @type {import("node:child_process").ChildProcess[]} */
  const children = [];
  const start = (/** @type {string} */ program, /** @type {string[]} */ args) => {
    const out = openSync(join(dir, "log", `${program}.out`), "a");
    const child = spawn(findProgram(program), args, { env, stdio: ["ignore", out, out] });
    children.push(child);
    if (child.pid !== undefined && process.env.CLIQUESCAPE_DAEMON_PIDS)
      appendFileSync(process.env.CLIQUESCAPE_DAEMON_PIDS, `${child.pid}\n`);
    return child;
  };
  const killAll = () => {
    for (const child of children)
      if (child.exitCode === null && child.signalCode === null) child.kill("SIGTERM");
  };
  process.once("exit", killAll);

  const run = (/** @type {string} */ program, /** @type {string[]} */ args) => {
    const result = spawnSync(findProgram(program) ?? program, args, { env, encoding: "utf8" });
    if (result.status !== 0)
      throw new Error(
        `${program} ${args.join(" ")} failed (${result.status}): ${result.stderr}${result.error ?? ""}`,
      );
    return result.stdout;
  };
  const logs = () =>
    ["munged.out", "slurmctld.log", "slurmd.log"]
      .map((name) => {
        const path = join(dir, "log", name);
        const text = existsSync(path) ? readFileSync(path, "utf8") : "(none)";
        return `--- ${name}\n${text.split("\n").slice(-15).join("\n")}`;
      })
      .join("\n");
  const stop = async () => {
    process.off("exit", killAll);
    killAll();
    const deadline = Date.now() + 15_000;
    while (children.some((c) => c.exitCode === null && c.signalCode === null) && Date.now() < deadline)
      await sleep(100);
    for (const child of children)
      if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
  };

  try {
    start("munged", [
      "--foreground",
      `--socket=${socket}`,
      `--key-file=${key}`,
      `--pid-file=${join(dir, "run", "munged.pid")}`,
      `--seed-file=${join(dir, "key", "munged.seed")}`,
      `--log-file=${join(dir, "log", "munged.log")}`,
    ]);
    for (let i = 0; !existsSync(socket); i++) {
      if (i > 100) throw new Error("munged did not create its socket within 10 s");
      await sleep(100);
    }
    start("slurmctld", ["-D", "-f", conf]);
    start("slurmd", ["-D", "-f", conf]);
    // The node is up once the controller sees it idle.
    for (let i = 0; ; i++) {
      const state = spawnSync(findProgram("sinfo"), ["-h", "-o", "%t"], {
        env,
        encoding: "utf8",
      }).stdout.trim();
      if (state === "idle") break;
      if (i > 300) throw new Error(`the test node did not come up within 30 s (sinfo: "${state}")`);
      await sleep(100);
    }
  } catch (error) {
    const text = logs();
    await stop();
    throw new Error(`${error.message}\n${text}`);
  }

  return {
    env,
    dir,
    run,
    logs,
    stop,
    jobState(/** @type {string} */ id) {
      const text = run("scontrol", ["show", "job", id]);
      return /JobState=(\S+)/.exec(text)?.[1] ?? "UNKNOWN";
    },
    async waitForJobs(/** @type {string[]} */ ids, /** @type {number} */ timeoutMs) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const result = spawnSync(
          findProgram("squeue"),
          ["-h", "-j", ids.join(","), "-t", "PD,R,CG,CF,S", "-o", "%i %T %r"],
          { env, encoding: "utf8" },
        );
        const listed = result.stdout.trim();
        // A job the controller has already forgotten is done as well.
        if (listed === "" && (result.status === 0 || /Invalid job id/i.test(result.stderr))) return;
        if (result.status !== 0 && !/Invalid job id/i.test(result.stderr))
          throw new Error(`squeue failed (${result.status}): ${result.stderr}`);
        if (Date.now() > deadline)
          throw new Error(`jobs still queued after ${timeoutMs / 1000} s:\n${listed}`);
        await sleep(200);
      }
    },
  };
}
