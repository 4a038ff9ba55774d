// A private Redis from Debian's redis-server, daemonised, bound to 127.0.0.1.
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { log, run, sleep, tcpOpen, waitFor } from "./proc.mjs";

/** Send one command in RESP and resolve the first reply (raw text). */
export function redisCommand(port, args, host = "127.0.0.1", timeoutMs = 2000) {
  return new Promise((resolve, reject) => {
    const socket = net.connect({ port, host });
    let data = "";
    socket.setTimeout(timeoutMs, () => {
      socket.destroy();
      reject(new Error("redis timeout"));
    });
    socket.once("connect", () => {
      socket.write(`*${args.length}\r\n${args.map((a) => `$${Buffer.byteLength(a)}\r\n${a}\r\n`).join("")}`);
    });
    socket.on("data", (d) => {
      data += d;
      // A simple or error reply ends at the first CRLF; an array reply (CONFIG GET) needs 4 lines.
      const lines = data.split("\r\n");
      if ((data.startsWith("*") && lines.length >= 6) || (!data.startsWith("*") && data.includes("\r\n"))) {
        socket.end();
        resolve(data);
      }
    });
    socket.once("error", reject);
    socket.once("close", () => resolve(data));
  });
}

const ping = (port) => redisCommand(port, ["PING"]).then((r) => r.startsWith("+PONG")).catch(() => false);

/**
 * Start Redis on 127.0.0.1:port with its files in `dir` (append-only file unless throwAway),
 * or adopt one already running from the same folder. Returns { stop() }.
 */
export async function startRedis({ port, dir, throwAway = false }) {
  fs.mkdirSync(dir, { recursive: true });
  const pidFile = path.join(dir, "redis.pid");
  if (await ping(port)) {
    const reply = await redisCommand(port, ["CONFIG", "GET", "dir"]).catch(() => "");
    if (!reply.includes(path.resolve(dir))) throw new Error(`port ${port} answers as another Redis (set REDIS_PORT to a free port)`);
    log("redis", `already running on port ${port}; using it`);
  } else {
    if (await tcpOpen(port)) throw new Error(`port ${port} is taken by another program (set REDIS_PORT to a free port)`);
    fs.rmSync(pidFile, { force: true });
    const args = [
      "--bind", "127.0.0.1", "--port", String(port), "--dir", path.resolve(dir),
      "--daemonize", "yes", "--pidfile", path.resolve(pidFile), "--logfile", path.resolve(dir, "redis.log"),
      "--protected-mode", "yes",
      ...(throwAway ? ["--save", "", "--appendonly", "no"] : ["--appendonly", "yes"]),
    ];
    await run("redis-server", args, { detached: true });
    await waitFor(`Redis on port ${port}`, () => ping(port), { timeoutMs: 20_000 });
  }
  return {
    async stop() {
      if (!(await ping(port))) return;
      await redisCommand(port, ["SHUTDOWN", throwAway ? "NOSAVE" : "SAVE"]).catch(() => "");
      for (let i = 0; i < 100 && (await tcpOpen(port)); i++) await sleep(100);
    },
  };
}
