// A private PostgreSQL 15 cluster from Debian's binaries, run as the `postgres` user.
// initdb and pg_ctl refuse to run as root, so both go through `runuser -u postgres --`.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { log, run, tcpOpen, waitFor } from "./proc.mjs";

const IDENT = /^[A-Za-z_][A-Za-z0-9_]*$/;

function asPostgres(binDir, tool, args, opts = {}) {
  // cwd "/" so postgres never needs access to root's working folder.
  return run("runuser", ["-u", "postgres", "--", path.join(binDir, tool), ...args], { cwd: "/", ...opts });
}

async function postgresCanTraverse(dir) {
  const { code } = await run("runuser", ["-u", "postgres", "--", "test", "-x", dir], { cwd: "/", allowFail: true });
  return code === 0;
}

let postgresIds = null;
function chownPostgres(p) {
  if (!postgresIds) {
    const m = fs.readFileSync("/etc/passwd", "utf8").match(/^postgres:[^:]*:(\d+):(\d+):/m);
    if (!m) throw new Error("no postgres user on this machine (install Debian's postgresql-15)");
    postgresIds = { uid: Number(m[1]), gid: Number(m[2]) };
  }
  fs.chownSync(p, postgresIds.uid, postgresIds.gid);
}

/**
 * Decide where the cluster lives: `<dataRoot>/pg` when the postgres user can reach it,
 * else /var/tmp/modewarden-<hash of the project folder> (a project inside a 0700 home folder).
 * The socket folder must stay short (socket paths are limited to 107 bytes).
 */
export async function resolvePgPaths(dataRoot) {
  fs.mkdirSync(dataRoot, { recursive: true, mode: 0o755 });
  fs.chmodSync(dataRoot, 0o755);
  let base = dataRoot;
  if (!(await postgresCanTraverse(dataRoot))) {
    const hash = crypto.createHash("sha1").update(path.resolve(dataRoot)).digest("hex").slice(0, 10);
    base = `/var/tmp/modewarden-${hash}`;
    fs.mkdirSync(base, { recursive: true, mode: 0o755 });
    log("pg", `postgres cannot reach ${dataRoot}; the cluster lives in ${base} instead`);
  }
  let socketDir = path.join(base, "pgsock");
  if (socketDir.length > 80) {
    const hash = crypto.createHash("sha1").update(socketDir).digest("hex").slice(0, 10);
    socketDir = `/tmp/mw-sock-${hash}`;
  }
  return { dataDir: path.join(base, "pg"), socketDir, logFile: path.join(base, "pg.log") };
}

/**
 * Start (initialising on first use) the cluster and make sure the application role and
 * database exist. Adopts a cluster already running from the same data folder.
 * Returns { stop(), dataDir, socketDir }.
 */
export async function startPostgres(o) {
  const { binDir, dataDir, socketDir, logFile, port, user, password, database, throwAway = false } = o;
  if (!IDENT.test(user) || !IDENT.test(database)) throw new Error("PGUSER and PGDATABASE must be plain identifiers");
  if (!fs.existsSync(path.join(binDir, "pg_ctl"))) throw new Error(`no PostgreSQL binaries in ${binDir} (install postgresql-15 or set PG_BIN_DIR)`);

  if (fs.existsSync(dataDir) && !fs.existsSync(path.join(dataDir, "PG_VERSION"))) {
    log("pg", `${dataDir} holds no cluster (interrupted initdb?); recreating it`);
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
  fs.mkdirSync(socketDir, { recursive: true });
  chownPostgres(socketDir);
  if (!fs.existsSync(logFile)) fs.writeFileSync(logFile, "");
  chownPostgres(logFile);

  if (!fs.existsSync(dataDir)) {
    fs.mkdirSync(dataDir, { mode: 0o700 });
    chownPostgres(dataDir);
    log("pg", `initdb ${dataDir}`);
    await asPostgres(binDir, "initdb", [
      "-D", dataDir, "-U", "postgres", "--auth-local=peer", "--auth-host=scram-sha-256",
      "-E", "UTF8", "--no-locale", ...(throwAway ? ["--no-sync"] : []),
    ]);
  }
  fs.chmodSync(dataDir, 0o700);

  const ready = async () => (await run(path.join(binDir, "pg_isready"), ["-q", "-h", socketDir, "-p", String(port)], { allowFail: true })).code === 0;
  if (await ready()) {
    log("pg", `cluster already running on port ${port}; using it`);
  } else {
    if (await tcpOpen(port)) throw new Error(`port ${port} is taken by another program (set PGPORT to a free port)`);
    const opts = [
      `-c listen_addresses=127.0.0.1`, `-c port=${port}`, `-c unix_socket_directories='${socketDir}'`,
      ...(throwAway ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
    ].join(" ");
    // pg_ctl handles a stale postmaster.pid itself; detached so Ctrl-C reaches only the launcher.
    await asPostgres(binDir, "pg_ctl", ["-D", dataDir, "-l", logFile, "-w", "-t", "60", "-s", "-o", opts, "start"], { detached: true }).catch((err) => {
      const tail = fs.existsSync(logFile) ? fs.readFileSync(logFile, "utf8").split("\n").slice(-15).join("\n") : "";
      throw new Error(`${err.message}\n--- ${logFile} ---\n${tail}`);
    });
    await waitFor(`PostgreSQL on port ${port}`, ready, { timeoutMs: 30_000 });
  }

  const pw = password.replace(/'/g, "''");
  const sql = `DO $$ BEGIN
    IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = '${user}') THEN CREATE ROLE "${user}" LOGIN PASSWORD '${pw}';
    ELSE ALTER ROLE "${user}" LOGIN PASSWORD '${pw}'; END IF; END $$;`;
  const psql = (args) => asPostgres(binDir, "psql", ["-X", "-q", "-v", "ON_ERROR_STOP=1", "-h", socketDir, "-p", String(port), "-d", "postgres", ...args]);
  await psql(["-c", sql]);
  const exists = await psql(["-tAc", `SELECT 1 FROM pg_database WHERE datname = '${database}'`]);
  if (exists.stdout.trim() !== "1") {
    await psql(["-c", `CREATE DATABASE "${database}" OWNER "${user}"`]);
    log("pg", `created database ${database}`);
  }

  return {
    dataDir,
    socketDir,
    async stop() {
      if (!(await ready())) return;
      await asPostgres(binDir, "pg_ctl", ["-D", dataDir, "-m", throwAway ? "immediate" : "fast", "-w", "-t", "60", "-s", "stop"], { allowFail: true });
    },
  };
}
