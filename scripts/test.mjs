#!/usr/bin/env node
// `npm test`: the whole suite on a throw-away stack of its own (PostgreSQL with fsync off,
// Redis, mail catcher, app on the test ports, everything under a temp folder).
//   lint → types → unit → integration → build + seed + app + worker → e2e
// Every stage runs even after a failure (except e2e after a failed build); the exit code is
// non-zero when any stage failed. Everything started is stopped, also on Ctrl-C.
//   npm test -- --stages=unit,integration   run some stages only
//   npm test -- --keep                      keep the temp folder (logs, database files)
//   npm test -- --stages=integration tests/integration/health.test.ts   filters go to vitest
//   npm test -- --services                  only start the test services and print their
//                                           environment; Ctrl-C stops them
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { childEnv, testConfig } from "./stack/config.mjs";
import { formatDuration, httpGet, log, tcpOpen, run, waitFor } from "./stack/proc.mjs";
import { resolvePgPaths, startPostgres } from "./stack/postgres.mjs";
import { startRedis } from "./stack/redis.mjs";
import { Supervisor } from "./stack/supervisor.mjs";
import { ensureDebianPackage, ensureNodeModules } from "./stack/system.mjs";
import { APP_PROCESS_ENV, buildIfNeeded, nextBin, TSX } from "./stack/app.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const ALL_STAGES = ["lint", "types", "unit", "integration", "e2e"];
const argStages = process.argv.find((a) => a.startsWith("--stages="))?.slice("--stages=".length);
const stages = argStages ? argStages.split(",").map((s) => s.trim()).filter(Boolean) : ALL_STAGES;
const keep = process.argv.includes("--keep");
const servicesOnly = process.argv.includes("--services");
const filters = process.argv.slice(2).filter((a) => !a.startsWith("--"));
for (const s of stages) if (!ALL_STAGES.includes(s)) throw new Error(`unknown stage ${s} (${ALL_STAGES.join(", ")})`);

const t0 = Date.now();
const results = []; // { stage, ok, ms, note }
const stoppers = [];
let cfg = null;
let current = null; // the running stage's child
let interrupted = false;
let cleaning = null;

const bin = {
  eslint: path.join(root, "node_modules/eslint/bin/eslint.js"),
  tsc: path.join(root, "node_modules/typescript/bin/tsc"),
  vitest: path.join(root, "node_modules/vitest/vitest.mjs"),
};

/** Run one stage's command with the terminal attached; resolves true on exit code 0. */
function stageCommand(args, env) {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, args, { cwd: root, env, stdio: "inherit" });
    current = child;
    child.on("error", (err) => {
      log("test", err.message);
      resolve(false);
    });
    child.on("exit", (code) => {
      current = null;
      resolve(code === 0);
    });
  });
}

async function stage(name, fn) {
  if (interrupted) return false;
  log("test", `── ${name} ──`);
  const t = Date.now();
  let ok = false;
  let note = "";
  try {
    ok = await fn();
  } catch (err) {
    note = err.message.split("\n")[0];
    log("test", `${name}: ${err.message}`);
  }
  results.push({ stage: name, ok, ms: Date.now() - t, note });
  log("test", `${name}: ${ok ? "passed" : "FAILED"} in ${formatDuration(Date.now() - t)}`);
  return ok;
}

let services = null;
/** PostgreSQL, Redis and the mail catcher on the test ports (started once, on first need). */
async function ensureServices() {
  if (services) return services;
  const env = childEnv(cfg, { MODEWARDEN_DEMO: "1" });
  const pgPaths = await resolvePgPaths(cfg.dataDir);
  const pg = await startPostgres({ binDir: cfg.pgBinDir, ...pgPaths, port: cfg.pgPort, ...cfg.pg, throwAway: true });
  stoppers.push(["PostgreSQL", () => pg.stop()]);
  const redis = await startRedis({ port: cfg.redisPort, dir: path.join(cfg.dataDir, "redis"), throwAway: true });
  stoppers.push(["Redis", () => redis.stop()]);
  const supervisor = new Supervisor({
    runDir: path.join(cfg.dataDir, "run"),
    onUnexpectedExit: (name, code) => log("test", `${name} exited unexpectedly (${code}); see ${path.join(cfg.dataDir, `${name}.log`)}`),
  });
  supervisor.start("mail", process.execPath, [...TSX, path.join(root, "scripts/mail-catcher.ts")], {
    env, cwd: root, logFile: path.join(cfg.dataDir, "mail.log"),
  });
  stoppers.push(["mail catcher", () => supervisor.stop("mail")]);
  await waitFor("the mail catcher", async () => (await httpGet(`http://127.0.0.1:${cfg.catcherPort}/health`)).status === 200, { timeoutMs: 30_000 });
  log("test", `services: PostgreSQL :${cfg.pgPort}, Redis :${cfg.redisPort}, SMTP :${cfg.smtpPort}, catcher :${cfg.catcherPort} (${cfg.dataDir})`);
  services = { env, supervisor };
  return services;
}

function tail(file, lines = 40) {
  return fs.existsSync(file) ? fs.readFileSync(file, "utf8").split("\n").slice(-lines).join("\n") : "(no log)";
}

async function e2eStage() {
  const { env, supervisor } = await ensureServices();
  await run(process.execPath, [...TSX, path.join(root, "scripts/migrate.ts")], { env, cwd: root, inherit: true });
  await run(process.execPath, [...TSX, path.join(root, "scripts/seed.ts")], { env, cwd: root, inherit: true });
  await buildIfNeeded(root, env);
  const appLog = path.join(cfg.dataDir, "app.log");
  const workerLog = path.join(cfg.dataDir, "worker.log");
  supervisor.start("app", process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(cfg.appPort)], {
    env: { ...env, ...APP_PROCESS_ENV, NODE_ENV: "production" }, cwd: root, logFile: appLog,
  });
  supervisor.start("worker", process.execPath, [...TSX, path.join(root, "workers/index.ts")], { env, cwd: root, logFile: workerLog });
  // Stop order: app, worker, then the services.
  stoppers.push(["worker", () => supervisor.stop("worker")], ["app", () => supervisor.stop("app")]);
  try {
    await waitFor("the test app's /api/health", async () => (await httpGet(`${cfg.appUrl}/api/health`)).status === 200, { timeoutMs: 120_000, intervalMs: 500 });
  } catch (err) {
    throw new Error(`${err.message}\n--- app log ---\n${tail(appLog)}`);
  }
  const ok = await stageCommand([bin.vitest, "run", "--project", "e2e", ...filters], { ...env, APP_URL: cfg.appUrl });
  if (!ok) log("test", `--- last lines of ${appLog} ---\n${tail(appLog, 30)}\n--- ${workerLog} ---\n${tail(workerLog, 15)}`);
  return ok;
}

async function cleanup() {
  cleaning ??= (async () => {
    for (const [name, stop] of [...stoppers].reverse()) {
      try {
        await stop();
      } catch (err) {
        log("test", `stopping ${name}: ${err.message}`);
      }
    }
    stoppers.length = 0;
    if (cfg?.removeDataDir && !keep) fs.rmSync(cfg.dataDir, { recursive: true, force: true });
    else if (cfg) log("test", `kept ${cfg.dataDir}`);
  })();
  return cleaning;
}

function summary() {
  log("test", "── summary ──");
  for (const r of results) log("test", `${r.ok ? "pass" : "FAIL"}  ${r.stage.padEnd(12)} ${formatDuration(r.ms).padStart(8)}${r.note ? `  ${r.note}` : ""}`);
  log("test", `total ${formatDuration(Date.now() - t0)}`);
}

for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"]) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    log("test", `${signal}: stopping the test stack`);
    current?.kill("SIGTERM");
    void cleanup().then(() => process.exit(130));
  });
}

// npm does not pass SIGTERM on through its `sh -c`: when our parent goes away, clean up too.
const parent = process.ppid;
setInterval(() => {
  if (process.ppid !== parent && !interrupted) process.emit("SIGTERM");
}, 1000).unref();

/** `--services`: the test stack alone, for running single vitest files by hand. */
async function serveOnly() {
  await ensureNodeModules(root);
  await ensureDebianPackage("/usr/bin/redis-server", "redis-server");
  cfg = testConfig(root);
  const { env } = await ensureServices();
  const names = ["PGPORT", "REDIS_PORT", "SMTP_PORT", "MAIL_CATCHER_HTTP_PORT", "MODEWARDEN_DATA_DIR", "MODEWARDEN_DEV_MAIL"];
  log("test", ["test services are up; in another shell:", `  export ${names.map((n) => `${n}=${env[n]}`).join(" ")}`,
    "  npx vitest run --project integration <file>", "Ctrl-C stops them."].join("\n"));
  setInterval(() => {}, 1 << 30);
  await new Promise(() => {});
}

async function main() {
  if (servicesOnly) return serveOnly();
  const needsServices = stages.includes("integration") || stages.includes("e2e");
  if (needsServices && process.getuid?.() !== 0) throw new Error("npm test runs as root (it manages a PostgreSQL cluster through runuser)");
  await ensureNodeModules(root);
  if (needsServices) await ensureDebianPackage("/usr/bin/redis-server", "redis-server");
  if (needsServices) await ensureDebianPackage("/usr/bin/pdftotext", "poppler-utils");
  cfg = testConfig(root);
  if (stages.includes("e2e")) await ensureDebianPackage(cfg.chromium, "chromium");
  if (needsServices) {
    for (const p of [cfg.pgPort, cfg.redisPort, cfg.smtpPort, cfg.catcherPort, ...(stages.includes("e2e") ? [cfg.appPort] : [])]) {
      if (await tcpOpen(p)) throw new Error(`test port ${p} is in use (another npm test running?); set TEST_* ports to free ones`);
    }
  }

  const plainEnv = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };
  if (stages.includes("lint")) await stage("lint", () => stageCommand([bin.eslint, "."], plainEnv));
  if (stages.includes("types")) await stage("types", () => stageCommand([bin.tsc, "--noEmit", "-p", "."], plainEnv));
  if (stages.includes("unit")) await stage("unit", () => stageCommand([bin.vitest, "run", "--project", "unit", ...filters], plainEnv));
  if (stages.includes("integration")) {
    await stage("integration", async () => {
      const { env } = await ensureServices();
      return stageCommand([bin.vitest, "run", "--project", "integration", ...filters], env);
    });
  }
  if (stages.includes("e2e")) await stage("e2e", e2eStage);
}

let failed = false;
try {
  await main();
} catch (err) {
  log("test", `set-up failed: ${err.message}`);
  failed = true;
} finally {
  await cleanup();
}
if (!interrupted) {
  summary();
  process.exit(failed || results.some((r) => !r.ok) ? 1 : 0);
}
