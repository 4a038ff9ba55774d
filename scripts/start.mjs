#!/usr/bin/env node
// `npm start`: set up a fresh clone and run the whole product on this machine.
// npm packages → redis-server → PostgreSQL cluster → Redis → mail catcher → migrations →
// demo seed → build → app + worker → a few fresh demo records per asset through the upload
// API (background, scripts/demo-fresh-records.ts). Ctrl-C / SIGTERM stops app, worker, catcher, Redis and
// PostgreSQL, in that order. Only Node built-ins here: node_modules may not exist yet.
import { spawn } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { childEnv, devConfig } from "./stack/config.mjs";
import { formatDuration, httpGet, log, run, tcpOpen, waitFor } from "./stack/proc.mjs";
import { resolvePgPaths, startPostgres } from "./stack/postgres.mjs";
import { startRedis } from "./stack/redis.mjs";
import { killStale, Supervisor } from "./stack/supervisor.mjs";
import { ensureDebianPackage, ensureNodeModules } from "./stack/system.mjs";
import { APP_PROCESS_ENV, buildIfNeeded, printDemoUsers, TSX, nextBin } from "./stack/app.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const t0 = Date.now();
const stoppers = []; // [name, stop] in start order; stopped in reverse
let shuttingDown = false;
let supervisor = null;

async function shutdown(code) {
  if (shuttingDown) return;
  shuttingDown = true;
  log("stack", "stopping: app, worker, mail catcher, Redis, PostgreSQL");
  for (const [name, stop] of [...stoppers].reverse()) {
    try {
      await stop();
      log("stack", `${name} stopped`);
    } catch (err) {
      log("stack", `${name}: ${err.message}`);
    }
  }
  process.exit(code);
}

for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"]) {
  process.on(signal, () => {
    if (shuttingDown) log("stack", "still stopping…");
    else void shutdown(0);
  });
}

async function main() {
  if (process.getuid?.() !== 0) throw new Error("npm start runs as root (it manages a PostgreSQL cluster through runuser)");
  await ensureNodeModules(root);
  await ensureDebianPackage("/usr/bin/redis-server", "redis-server");

  const cfg = devConfig(root);
  const env = childEnv(cfg, { MODEWARDEN_DEMO: "1" });
  // Leftovers of a launcher that was killed (kill -9, closed terminal) hold our ports.
  await Promise.all(["app", "worker", "mail"].map((n) => killStale(path.join(cfg.dataDir, "run", `${n}.pid`))));
  for (const [name, p] of [["app", cfg.appPort], ["mail catcher SMTP", cfg.smtpPort], ["mail catcher HTTP", cfg.catcherPort]]) {
    if (await tcpOpen(p)) throw new Error(`port ${p} (${name}) is in use; stop that program or choose another port`);
  }

  supervisor = new Supervisor({
    runDir: path.join(cfg.dataDir, "run"),
    onUnexpectedExit: (name, code) => {
      log("stack", `${name} exited unexpectedly (${code}); stopping everything`);
      void shutdown(1);
    },
  });

  const pgPaths = await resolvePgPaths(cfg.dataDir);
  const pg = await startPostgres({ binDir: cfg.pgBinDir, ...pgPaths, port: cfg.pgPort, ...cfg.pg });
  stoppers.push(["PostgreSQL", () => pg.stop()]);
  log("pg", `PostgreSQL 15 on 127.0.0.1:${cfg.pgPort} (data ${pg.dataDir})`);

  const redis = await startRedis({ port: cfg.redisPort, dir: path.join(cfg.dataDir, "redis") });
  stoppers.push(["Redis", () => redis.stop()]);
  log("redis", `Redis on 127.0.0.1:${cfg.redisPort} (append-only, ${path.join(cfg.dataDir, "redis")})`);

  supervisor.start("mail", process.execPath, [...TSX, path.join(root, "scripts/mail-catcher.ts")], { env, cwd: root });
  stoppers.push(["mail catcher", () => supervisor.stop("mail")]);
  await waitFor("the mail catcher", async () => (await httpGet(`http://127.0.0.1:${cfg.catcherPort}/health`)).status === 200, { timeoutMs: 30_000 });

  await run(process.execPath, [...TSX, path.join(root, "scripts/migrate.ts")], { env, cwd: root, inherit: true });
  await run(process.execPath, [...TSX, path.join(root, "scripts/seed.ts")], { env, cwd: root, inherit: true });
  await buildIfNeeded(root, env);

  supervisor.start("app", process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(cfg.appPort)], {
    env: { ...env, ...APP_PROCESS_ENV, NODE_ENV: "production" },
    cwd: root,
  });
  stoppers.push(["app", () => supervisor.stop("app")]);
  supervisor.start("worker", process.execPath, [...TSX, path.join(root, "workers/index.ts")], { env, cwd: root });
  // Stop order is app, worker, catcher, Redis, PostgreSQL: the worker's stopper sits just
  // before the app's in the (reversed) list.
  stoppers.splice(stoppers.length - 1, 0, ["worker", () => supervisor.stop("worker")]);

  const health = `http://127.0.0.1:${cfg.appPort}/api/health`;
  await waitFor("the app's /api/health", async () => (await httpGet(health)).status === 200, { timeoutMs: 120_000, intervalMs: 500 });

  const demo = await printDemoUsers(root, env);
  log("stack", [
    "",
    `Modewarden is running: ${cfg.appUrl}   (ready in ${formatDuration(Date.now() - t0)})`,
    `  caught e-mail:   ${cfg.appUrl}/dev/mail`,
    `  health:          ${health}`,
    "  demo sign-ins:",
    ...demo.map((u) => `    ${u.role.padEnd(10)} ${u.email.padEnd(28)} ${u.password}`),
    "Press Ctrl-C to stop everything.",
    "",
  ].join("\n"));
  startFreshDemoRecords(cfg.appUrl, env);
}

/**
 * In the background: a few short simulated records per demo asset through the real upload
 * API with the demo gateway keys, so the queue visibly works; one line per asset when the
 * worker has answered. Stopped with everything else on Ctrl-C.
 */
function startFreshDemoRecords(appUrl, env) {
  const child = spawn(process.execPath, [...TSX, path.join(root, "scripts/demo-fresh-records.ts"), "--url", appUrl, "--count", "2"], {
    env, cwd: root, stdio: ["ignore", "pipe", "pipe"],
  });
  let rest = "";
  const relay = (chunk) => {
    const lines = (rest + chunk.toString("utf8")).split("\n");
    rest = lines.pop() ?? "";
    for (const line of lines) if (line.trim()) log("demo", line.replace(/^\[demo\] /, ""));
  };
  child.stdout.on("data", relay);
  child.stderr.on("data", relay);
  let running = true;
  child.on("exit", (code) => {
    running = false;
    if (code) log("demo", `fresh demo records ended with exit code ${code}`);
  });
  log("demo", "sending 2 fresh simulated records per demo asset through the upload API…");
  stoppers.push(["fresh demo records", async () => {
    if (!running) return;
    child.kill("SIGTERM");
    await new Promise((resolve) => {
      const t = setTimeout(() => { child.kill("SIGKILL"); resolve(); }, 3000);
      child.once("exit", () => { clearTimeout(t); resolve(); });
    });
  }]);
}

main().catch((err) => {
  log("stack", `start failed: ${err.message}`);
  void shutdown(1);
});

// npm does not pass SIGTERM on through its `sh -c`: when our parent goes away, stop too.
// The interval also keeps the event loop alive while the children run.
const parent = process.ppid;
setInterval(() => {
  if (process.ppid !== parent && !shuttingDown) {
    log("stack", "the parent process ended");
    void shutdown(0);
  }
}, 1000);
