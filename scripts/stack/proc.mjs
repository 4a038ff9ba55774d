// Process helpers for the launchers (plain Node: they run before node_modules exist).
import { spawn } from "node:child_process";
import net from "node:net";
import http from "node:http";

const COLOURS = { stack: 36, app: 32, worker: 35, mail: 33, test: 34, pg: 90, redis: 90 };

/** Print one launcher line with a coloured tag (no colour when stdout is not a TTY). */
export function log(tag, message) {
  const c = COLOURS[tag] ?? 37;
  const label = process.stdout.isTTY ? `\x1b[${c}m[${tag}]\x1b[0m` : `[${tag}]`;
  for (const line of String(message).split("\n")) process.stdout.write(`${label} ${line}\n`);
}

/**
 * Run a command to completion. Resolves { code, stdout, stderr }; rejects on a non-zero exit
 * unless allowFail. With `inherit`, output goes straight to the terminal.
 */
export function run(cmd, args, opts = {}) {
  const { env = process.env, cwd, allowFail = false, inherit = false, detached = false, input } = opts;
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, {
      env,
      cwd,
      detached,
      stdio: [input === undefined ? "ignore" : "pipe", inherit ? "inherit" : "pipe", inherit ? "inherit" : "pipe"],
    });
    let stdout = "";
    let stderr = "";
    child.stdout?.on("data", (d) => (stdout += d));
    child.stderr?.on("data", (d) => (stderr += d));
    if (input !== undefined) child.stdin.end(input);
    child.on("error", (err) => reject(err));
    child.on("close", (code, signal) => {
      const result = { code: code ?? (signal ? 128 : 1), stdout, stderr };
      if (result.code !== 0 && !allowFail) {
        const err = new Error(`${cmd} ${args.join(" ")} exited with ${code ?? signal}\n${stderr || stdout}`.trim());
        err.result = result;
        reject(err);
      } else resolve(result);
    });
  });
}

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Poll `check` until it returns a truthy value or the deadline passes (then throws). */
export async function waitFor(what, check, { timeoutMs = 60_000, intervalMs = 250 } = {}) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check().catch(() => false);
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out after ${Math.round(timeoutMs / 1000)} s waiting for ${what}`);
    await sleep(intervalMs);
  }
}

/** True when something accepts TCP connections on host:port. */
export function tcpOpen(port, host = "127.0.0.1", timeoutMs = 1000) {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    const done = (v) => {
      socket.destroy();
      resolve(v);
    };
    socket.setTimeout(timeoutMs, () => done(false));
    socket.once("connect", () => done(true));
    socket.once("error", () => done(false));
  });
}

/** GET a URL; resolves { status, body } (never rejects on HTTP status, rejects on network). */
export function httpGet(url, timeoutMs = 5000) {
  return new Promise((resolve, reject) => {
    const req = http.get(url, { timeout: timeoutMs }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (d) => (body += d));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("timeout", () => req.destroy(new Error("timeout")));
    req.on("error", reject);
  });
}

/** Whether a pid is alive (signal 0). */
export function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return err.code === "EPERM";
  }
}

export function formatDuration(ms) {
  return ms < 1000 ? `${ms} ms` : `${(ms / 1000).toFixed(1)} s`;
}
