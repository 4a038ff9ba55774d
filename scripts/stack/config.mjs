// Launcher configuration. Same variable names and defaults as lib/config/env.ts (the launchers
// run before node_modules exist, so they read process.env directly).
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const e = process.env;

function port(name, fallback) {
  const raw = e[name];
  if (raw === undefined || raw === "") return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 65535) throw new Error(`${name} must be a port number (got ${raw})`);
  return n;
}

function common(root) {
  return {
    root,
    pgBinDir: e.PG_BIN_DIR || "/usr/lib/postgresql/15/bin",
    chromium: e.CHROMIUM_PATH || "/usr/bin/chromium",
    pg: {
      user: e.PGUSER || "modewarden",
      password: e.PGPASSWORD || "modewarden",
      database: e.PGDATABASE || "modewarden",
    },
  };
}

/** `npm start`: the folders under MODEWARDEN_DATA_DIR (default .data) and the dev ports. */
export function devConfig(root) {
  const appPort = port("APP_PORT", 3000);
  const dataDir = path.resolve(root, e.MODEWARDEN_DATA_DIR || ".data");
  return {
    ...common(root),
    mode: "dev",
    dataDir,
    pgPort: port("PGPORT", 54329),
    redisPort: port("REDIS_PORT", 63799),
    smtpPort: port("SMTP_PORT", 2525),
    catcherPort: port("MAIL_CATCHER_HTTP_PORT", 2580),
    appPort,
    appUrl: e.APP_URL || `http://127.0.0.1:${appPort}`,
    secret: e.NEXTAUTH_SECRET || persistentSecret(dataDir),
  };
}

/** `npm test`: a throw-away folder (TEST_DATA_DIR or a fresh temp folder) and the test ports. */
export function testConfig(root) {
  const appPort = port("TEST_APP_PORT", 3100);
  const given = e.TEST_DATA_DIR ? path.resolve(root, e.TEST_DATA_DIR) : null;
  const dataDir = given ?? fs.mkdtempSync(path.join(os.tmpdir(), "modewarden-test-"));
  fs.chmodSync(dataDir, 0o755);
  return {
    ...common(root),
    mode: "test",
    dataDir,
    removeDataDir: !given,
    pgPort: port("TEST_PGPORT", 54339),
    redisPort: port("TEST_REDIS_PORT", 63809),
    smtpPort: port("TEST_SMTP_PORT", 2535),
    catcherPort: port("TEST_MAIL_CATCHER_HTTP_PORT", 2590),
    appPort,
    appUrl: `http://127.0.0.1:${appPort}`,
    secret: crypto.randomBytes(32).toString("hex"),
  };
}

/** A NEXTAUTH_SECRET kept in the data folder so sessions survive a restart of `npm start`. */
function persistentSecret(dataDir) {
  const file = path.join(dataDir, "nextauth-secret");
  fs.mkdirSync(dataDir, { recursive: true });
  if (!fs.existsSync(file)) fs.writeFileSync(file, crypto.randomBytes(32).toString("hex"), { mode: 0o600 });
  return fs.readFileSync(file, "utf8").trim();
}

/** The environment every child (migrations, seed, catcher, app, worker, tests) receives. */
export function childEnv(cfg, extra = {}) {
  return {
    ...process.env,
    MODEWARDEN_DATA_DIR: cfg.dataDir,
    PGHOST: "127.0.0.1",
    PGPORT: String(cfg.pgPort),
    PGUSER: cfg.pg.user,
    PGPASSWORD: cfg.pg.password,
    PGDATABASE: cfg.pg.database,
    REDIS_HOST: "127.0.0.1",
    REDIS_PORT: String(cfg.redisPort),
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(cfg.smtpPort),
    MAIL_CATCHER_HTTP_PORT: String(cfg.catcherPort),
    MODEWARDEN_DEV_MAIL: "1",
    APP_PORT: String(cfg.appPort),
    APP_URL: cfg.appUrl,
    NEXTAUTH_URL: cfg.appUrl,
    NEXTAUTH_SECRET: cfg.secret,
    PG_BIN_DIR: cfg.pgBinDir,
    CHROMIUM_PATH: cfg.chromium,
    NEXT_TELEMETRY_DISABLED: "1",
    ...extra,
  };
}
