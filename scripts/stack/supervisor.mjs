// Long-running children (app, worker, mail catcher): each in its own process group so a
// terminal Ctrl-C reaches only the launcher, which then stops them in a fixed order.
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import readline from "node:readline";
import { alive, log, sleep } from "./proc.mjs";

function signalGroup(pid, signal) {
  try {
    process.kill(-pid, signal);
  } catch {
    try {
      process.kill(pid, signal);
    } catch {
      /* already gone */
    }
  }
}

/** Kernel start time of a pid (field 22 of /proc/<pid>/stat), or null if it is gone. */
function startTime(pid) {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2).split(" ")[19] ?? null;
  } catch {
    return null;
  }
}

/**
 * Stop a process left behind by an earlier run (its launcher was killed): the pid file holds
 * "<pid> <start time>", so a recycled pid is never mistaken for ours (next-server rewrites
 * its command line, so the start time is the identity check).
 */
export async function killStale(pidFile) {
  if (!fs.existsSync(pidFile)) return;
  const [pidText, started] = fs.readFileSync(pidFile, "utf8").trim().split(" ");
  fs.rmSync(pidFile, { force: true });
  const pid = Number(pidText);
  if (!Number.isInteger(pid) || pid <= 1 || !alive(pid) || startTime(pid) !== started) return;
  log("stack", `stopping a leftover process ${pid} (${path.basename(pidFile, ".pid")})`);
  signalGroup(pid, "SIGTERM");
  for (let i = 0; i < 100 && alive(pid); i++) await sleep(100);
  if (alive(pid)) signalGroup(pid, "SIGKILL");
}

export class Supervisor {
  /** @param {{ runDir: string, onUnexpectedExit?: (name: string, code: number|null) => void }} o */
  constructor({ runDir, onUnexpectedExit }) {
    this.runDir = runDir;
    this.onUnexpectedExit = onUnexpectedExit;
    this.children = new Map();
    fs.mkdirSync(runDir, { recursive: true });
  }

  pidFile(name) {
    return path.join(this.runDir, `${name}.pid`);
  }

  /**
   * Start a child. Output is prefixed with [name] on the terminal, or appended to logFile.
   * Resolves once spawned.
   */
  start(name, cmd, args, { env, cwd, logFile } = {}) {
    const child = spawn(cmd, args, { env, cwd, detached: true, stdio: ["ignore", "pipe", "pipe"] });
    const entry = { child, stopping: false, exited: false, exit: null };
    entry.exit = new Promise((resolve) => {
      child.on("exit", (code, signal) => {
        entry.exited = true;
        fs.rmSync(this.pidFile(name), { force: true });
        if (!entry.stopping) this.onUnexpectedExit?.(name, code ?? signal);
        resolve(code);
      });
    });
    child.on("error", (err) => log("stack", `${name}: ${err.message}`));
    if (logFile) {
      const out = fs.createWriteStream(logFile, { flags: "a" });
      child.stdout.pipe(out);
      child.stderr.pipe(out);
    } else {
      for (const stream of [child.stdout, child.stderr]) {
        readline.createInterface({ input: stream }).on("line", (line) => log(name, line));
      }
    }
    if (child.pid) fs.writeFileSync(this.pidFile(name), `${child.pid} ${startTime(child.pid)}`);
    this.children.set(name, entry);
    return child;
  }

  isRunning(name) {
    const e = this.children.get(name);
    return !!e && !e.exited;
  }

  /** SIGTERM the child's group, SIGKILL after timeoutMs. */
  async stop(name, timeoutMs = 10_000) {
    const entry = this.children.get(name);
    if (!entry || entry.exited) return;
    entry.stopping = true;
    signalGroup(entry.child.pid, "SIGTERM");
    const timer = setTimeout(() => {
      log("stack", `${name} did not stop within ${timeoutMs / 1000} s; killing it`);
      signalGroup(entry.child.pid, "SIGKILL");
    }, timeoutMs);
    await entry.exit;
    clearTimeout(timer);
    // Grandchildren (e.g. next's render workers) share the group: make sure they are gone too.
    signalGroup(entry.child.pid, "SIGKILL");
  }
}
