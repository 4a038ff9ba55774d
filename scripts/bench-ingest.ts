/**
 * npm run bench:ingest — the gateway-to-result pipeline on a throw-away stack of its own
 * (`node scripts/test.mjs --services`: PostgreSQL and Redis on the TEST_* ports, a temp
 * folder, all stopped at the end; `--use-env` uses the stack the environment names instead):
 *  0. memory warm-up: a throw-away process touches a few GiB and exits (see warmMemory);
 *     `--cold-memory` skips it;
 *  1. upload acceptance latency p50/p95 of the standard record (16 channels, 200 Hz, 600 s,
 *     float32 LE, sent gzip-compressed and plain) with 8 gateways uploading at once, each back
 *     to back, over loopback HTTP to the built app (`next start`, built first when .next does
 *     not hold a build of this commit), and the server's CPU per upload; `--harness` sends them
 *     to a node:http server wrapping the route handler instead (and reports its garbage
 *     collections). Then the same against a "floor" server doing only the contract's
 *     unavoidable work (see --serve-floor), which bounds what any route can reach here;
 *  2. sustained analysis throughput of one worker process (concurrency 1) draining a backlog,
 *     FDD/EFDD settings and, separately, FDD + SSI-COV settings: per wall minute and per
 *     minute of the worker's own CPU (the honest "per core" figure on a shared machine);
 *  3. idle end-to-end latency: upload → the gateway reads status `analysed`, worker idle.
 * Prints a table with the load average before and after; not a test (no pass/fail).
 *   --acceptance-only   stop after step 1;  --cpu-prof-dir=DIR   V8 CPU profiles of the app, harness and workers
 *   --harness --node-body   the harness hands the ingest service the Node request stream itself
 *                           (no web-stream Request body; the cost of that body, measured)
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { createServer, request as httpRequest, Agent, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { Readable } from "node:stream";
import { cpus, loadavg, tmpdir } from "node:os";
import { constants, PerformanceObserver } from "node:perf_hooks";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { simplySupportedBeamModes, simulateAmbientRecord } from "@/lib/simulate";
import { APP_PROCESS_ENV, buildIfNeeded, nextBin } from "./stack/app.mjs";

const N_CH = 16, FS = 200, DURATION_S = 600, GATEWAYS = 8, ROUNDS = 8, SSI_RECORDS = 6, IDLE_RUNS = 5, STALL_S = 120;
const ROOT = new URL("..", import.meta.url).pathname;
const children: ChildProcess[] = [];

/** Beam of the e2e test, 16 sensors: modes 2.5, 10, 22.5, 40 Hz (Blevins Table 8-1). */
const BENCH_BEAM = { lengthM: 30, flexuralRigidityNm2: 1.026e10, massPerLengthKgPerM: 5000 };
const BENCH_CODES = Array.from({ length: N_CH }, (_, i) => `S${String(i + 1).padStart(2, "0")}`);
const benchSensorX = () => BENCH_CODES.map((_, i) => ((i + 1) * BENCH_BEAM.lengthM) / (N_CH + 1));

interface Ready { port: number; fddKeys: string[]; ssiKey: string; pid: number }
interface Answer {
  status: number;
  body: { record?: { id: string; status: string }; error?: { code: string }; analysis?: { spectral: { nperseg: number; averages: number; lineSpacingHz: number } } };
}

const ms = (t: bigint) => Number(t) / 1e6;
const pct = (xs: number[], p: number) => { const a = [...xs].sort((x, y) => x - y); return a[Math.min(a.length - 1, Math.ceil((p / 100) * a.length) - 1)]; };
const median = (xs: number[]) => pct(xs, 50);
/** utime + stime of a process in seconds (/proc/<pid>/stat fields 14–15, USER_HZ = 100). */
function cpuSeconds(pid: number): number {
  const [user, sys] = cpuSplit(pid);
  return user + sys;
}
/** [utime, stime] of a process in seconds: user space (JS, zlib, hashing) and kernel (sockets, files). */
function cpuSplit(pid: number): [number, number] {
  const f = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return [Number(f[11]) / 100, Number(f[12]) / 100];
}

/** Garbage collections of this process so far (perf_hooks "gc" entries): count and pause ms by kind. */
function gcCounter(): () => GcTotals {
  const totals: GcTotals = { minor: 0, major: 0, pauseMs: 0 };
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) {
      const kind = (e as PerformanceEntry & { detail?: { kind?: number } }).detail?.kind ?? 0;
      if (kind === constants.NODE_PERFORMANCE_GC_MAJOR) totals.major++;
      else if (kind === constants.NODE_PERFORMANCE_GC_MINOR) totals.minor++;
      totals.pauseMs += e.duration;
    }
  }).observe({ entryTypes: ["gc"] });
  return () => ({ ...totals });
}
interface GcTotals { minor: number; major: number; pauseMs: number; poolMadeBytes?: number }
/** The GC totals of a bench server (GET /bench/gc); null from a server without that route (the Next app). */
async function gcOf(port: number): Promise<GcTotals | null> {
  return new Promise((resolve, reject) => {
    httpRequest({ host: "127.0.0.1", port, path: "/bench/gc", agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve(res.statusCode === 200 ? JSON.parse(Buffer.concat(chunks).toString("utf8")) as GcTotals : null));
    }).on("error", reject).end();
  });
}

/** CPU seconds (user + system) of all processes named `comm` (/proc/<pid>/stat): PostgreSQL's backends, Redis. */
function cpuOfComm(comm: string): number {
  let total = 0;
  for (const pid of readdirSync("/proc").filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
      if (!stat.includes(`(${comm})`)) continue;
      const f = stat.split(") ")[1].split(" ");
      total += (Number(f[11]) + Number(f[12])) / 100;
    } catch {
      // the process ended meanwhile
    }
  }
  return total;
}

/** Minor page faults of a process so far (/proc/<pid>/stat field 10). */
function minorFaults(pid: number): number {
  return Number(readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ")[7]);
}

/** The standard record once, float32 LE interleaved; the first frame is varied per upload. */
function standardRecord(): { firstFrame: Float32Array; restGz: Buffer; restRaw: Buffer; rawBytes: number } {
  const modes = simplySupportedBeamModes({ ...BENCH_BEAM, sensorPositionsM: benchSensorX(), modeCount: 4 });
  const { data } = simulateAmbientRecord({
    modes: modes.map((m) => ({ frequencyHz: m.frequencyHz, dampingRatio: 0.01, shape: m.shape })), sampleRateHz: FS, durationS: DURATION_S, seed: 1,
  });
  const n = data[0].length;
  const f32 = new Float32Array(n * N_CH);
  for (let k = 0; k < n; k++) for (let c = 0; c < N_CH; c++) f32[k * N_CH + c] = data[c][k];
  const bytes = Buffer.from(f32.buffer);
  return { firstFrame: f32.slice(0, N_CH), restGz: gzipSync(bytes.subarray(4 * N_CH)), restRaw: bytes.subarray(4 * N_CH), rawBytes: bytes.length };
}

/** How the bench gateways send the samples: float32 LE gzip-compressed, or plain. */
type Encoding = "gzip" | "plain";

/**
 * A multipart body as pieces: a unique first frame + the shared rest of the samples (with
 * gzip, two members, RFC 1952 §2.2). Sent piece by piece, so the bench process does not copy
 * 7 MB per upload on the cores the server is measured on (a gateway is another machine).
 */
function body(rec: ReturnType<typeof standardRecord>, recordId: string, variant: number, encoding: Encoding): { pieces: Buffer[]; type: string } {
  const frame = rec.firstFrame.slice();
  frame[0] += variant * 1e-6;
  const samples = encoding === "gzip" ? [gzipSync(Buffer.from(frame.buffer)), rec.restGz] : [Buffer.from(frame.buffer), rec.restRaw];
  const b = `----bench${recordId}`;
  const meta = JSON.stringify({ recordId, startedAt: new Date().toISOString(), sampleRateHz: FS, channels: BENCH_CODES, units: "m/s2", temperatureC: 12 });
  const head = `--${b}\r\ncontent-disposition: form-data; name="meta"\r\n\r\n${meta}\r\n--${b}\r\ncontent-disposition: form-data; name="data"; filename="r.f32${encoding === "gzip" ? ".gz" : ""}"\r\ncontent-type: application/octet-stream\r\n\r\n`;
  return { pieces: [Buffer.from(head), ...samples, Buffer.from(`\r\n--${b}--\r\n`)], type: `multipart/form-data; boundary=${b}` };
}

const agent = new Agent({ keepAlive: true, maxSockets: GATEWAYS + 2 });
const byteLength = (pieces: Buffer[]) => pieces.reduce((n, p) => n + p.length, 0);
function send(port: number, method: string, path: string, key: string, payload?: { pieces: Buffer[]; type: string }): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const headers: Record<string, string | number> = { authorization: `Bearer ${key}` };
    if (payload) Object.assign(headers, { "content-type": payload.type, "content-length": byteLength(payload.pieces) });
    const req = httpRequest({ host: "127.0.0.1", port, method, path, headers, agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body: JSON.parse(Buffer.concat(chunks).toString("utf8") || "{}") as Answer["body"] }));
    });
    req.on("error", reject);
    for (const p of payload?.pieces ?? []) req.write(p);
    req.end();
  });
}

/**
 * The built app (`next start`) on its own port with the stack's environment and the app
 * process environment of `npm start`; the harness process has set up the organisation, assets
 * and gateways in the same database. Returns the port and the server's pid (whose CPU counts).
 */
async function startNextApp(vars: string[], appVars: string[]): Promise<{ port: number; pid: number }> {
  const port = 3190;
  const app = spawnWith([...vars, ...appVars, "NODE_ENV=production", "NEXTAUTH_SECRET=bench-only-secret-not-for-use-0123456789", "LOG_LEVEL=warn",
    "UPLOAD_RATE_LIMIT_PER_MINUTE=100000", `APP_URL=http://127.0.0.1:${port}`], [...profFlags(), nextBin(ROOT), "start", "-H", "127.0.0.1", "-p", String(port)]);
  await waitLine(app, /Ready in|started server/i, "next start");
  app.stderr!.on("data", (c: Buffer) => process.stderr.write(`[app] ${String(c)}`));
  for (let i = 0; i < 100; i++) {
    const ok = await new Promise<boolean>((resolve) => httpRequest({ host: "127.0.0.1", port, path: "/api/health", agent }, (res) => { res.resume(); resolve(res.statusCode === 200); })
      .on("error", () => resolve(false)).end());
    if (ok) break;
    await new Promise((r) => setTimeout(r, 300));
  }
  // spawnWith runs env(1), which execs node in place: the child's pid is the server's.
  return { port, pid: app.pid! };
}

/**
 * This machine is a VM whose memory is backed on first touch: writing a new 7.7 MB blob into
 * never-touched memory cost 11 ms of kernel time here, into memory touched before 1.7 ms. A
 * server that has been up for a while writes its page cache into recycled memory, so before
 * measuring, a throw-away process touches min(8 GiB, 60 % of MemAvailable) and exits.
 */
async function warmMemory(): Promise<number> {
  const available = Number(/MemAvailable:\s+(\d+) kB/.exec(readFileSync("/proc/meminfo", "utf8"))?.[1] ?? 0) * 1024;
  const chunks = Math.floor(Math.min(8 * 2 ** 30, 0.6 * available) / 2 ** 28);
  await new Promise<void>((resolve, reject) => spawn(process.execPath, ["-e", `const a = []; for (let i = 0; i < ${chunks}; i++) a.push(Buffer.alloc(2 ** 28, 1));`], { stdio: "ignore" })
    .once("exit", (code) => (code === 0 ? resolve() : reject(new Error(`memory warm-up failed (${code})`)))));
  return chunks / 4;
}

/** --cpu-prof-dir=DIR: the server and each worker write a V8 CPU profile there when they stop. */
function profFlags(): string[] {
  const dir = process.argv.find((a) => a.startsWith("--cpu-prof-dir="))?.slice("--cpu-prof-dir=".length);
  return dir ? ["--cpu-prof", `--cpu-prof-dir=${dir}`] : [];
}

/** Spawn with extra environment variables through env(1), inheriting the rest. */
function spawnWith(vars: string[], args: string[]): ChildProcess {
  const child = spawn("env", [...vars, process.execPath, ...args], { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"] });
  children.push(child);
  return child;
}
function lines(child: ChildProcess, onLine: (line: string) => void): void {
  let buf = "";
  child.stdout!.setEncoding("utf8").on("data", (c: string) => {
    buf += c;
    const parts = buf.split("\n");
    buf = parts.pop() ?? "";
    parts.forEach(onLine);
  });
}
const waitLine = (child: ChildProcess, re: RegExp, what: string) => new Promise<RegExpExecArray>((resolve, reject) => {
  let err = "";
  child.stderr!.setEncoding("utf8").on("data", (c: string) => { err += c; });
  child.once("exit", (code) => reject(new Error(`${what} exited (${code}) before it was ready:\n${err.slice(-2000)}`)));
  lines(child, (l) => { const m = re.exec(l); if (m) resolve(m); });
});
async function stop(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((r) => child.once("exit", r));
  child.kill(signal);
  await exited;
}

/** A worker process; resolves each completed analyse-<id> with its time (ms, hrtime). */
async function startWorker(vars: string[]) {
  const child = spawnWith([...vars, "ANALYSIS_CONCURRENCY=1", "ANALYSIS_SWEEP_INTERVAL_S=3600"], [...profFlags(), "--import", "tsx", "workers/index.ts"]);
  const done = new Map<string, number>();
  const w = { child, done, failure: null as string | null };
  const ready = waitLine(child, /^worker ready/, "the worker");
  lines(child, (l) => { const m = /^analysis job analyse-([0-9a-f-]{36}) completed/.exec(l); if (m) done.set(m[1], ms(process.hrtime.bigint())); });
  // A failed attempt ends the bench: its figures would not describe the pipeline.
  child.stderr!.on("data", (c: string) => { const m = /^analysis job .* failed .*$/m.exec(c); if (m) w.failure ??= m[0]; });
  await ready;
  return w;
}

/** Wait until every id is in `done`; throws on a failed job or after STALL_S without progress. */
async function awaitAll(w: Awaited<ReturnType<typeof startWorker>>, ids: string[], onProgress?: () => void): Promise<void> {
  let seen = -1, since = Date.now();
  while (ids.some((id) => !w.done.has(id))) {
    if (w.failure) throw new Error(`the worker failed a job: ${w.failure}`);
    if (w.done.size !== seen) { seen = w.done.size; since = Date.now(); onProgress?.(); }
    if (Date.now() - since > STALL_S * 1000) throw new Error(`no analysis finished for ${STALL_S} s (${w.done.size}/${ids.length} done)`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

async function drain(vars: string[], ids: string[]): Promise<{ perWallMin: number; perCpuMin: number; msEach: number }> {
  const w = await startWorker(vars);
  let firstCpu = -1;
  await awaitAll(w, ids, () => { if (firstCpu < 0 && w.done.size > 0) firstCpu = cpuSeconds(w.child.pid!); });
  const cpu = cpuSeconds(w.child.pid!) - firstCpu;
  const times = ids.map((id) => w.done.get(id)!).sort((a, b) => a - b);
  await stop(w.child);
  // Steady state: from the first completion to the last (the first record pays JIT warm-up).
  const wallS = (times[times.length - 1] - times[0]) / 1000;
  return { perWallMin: ((ids.length - 1) / wallS) * 60, perCpuMin: ((ids.length - 1) / cpu) * 60, msEach: (wallS * 1000) / (ids.length - 1) };
}

interface Upload { id: string; ms: number; bytes: number }

/**
 * Acceptance latency against one server process: a warm-up (each gateway once, then all
 * GATEWAYS at the same moment, so buffers and memory are as in steady operation), then ROUNDS
 * back-to-back uploads per gateway, all gateways at once; then 3 uploads alone. The server's
 * CPU (from /proc) is counted over the concurrent part.
 */
async function acceptance(pid: number, port: number, uploadAs: (gateway: number) => Promise<Upload>) {
  const gateways = Array.from({ length: GATEWAYS }, (_, i) => i);
  for (const g of gateways) await uploadAs(g);
  await Promise.all(gateways.map(uploadAs));
  const gc0 = await gcOf(port);
  const split0 = cpuSplit(pid);
  const faults0 = minorFaults(pid);
  const services0 = cpuOfComm("postgres") + cpuOfComm("redis-server");
  const client0 = process.cpuUsage();
  const lat: number[] = [];
  let sentBytes = 0;
  await Promise.all(gateways.map(async (g) => {
    for (let i = 0; i < ROUNDS; i++) {
      const u = await uploadAs(g);
      lat.push(u.ms);
      sentBytes = u.bytes;
    }
  }));
  const split1 = cpuSplit(pid);
  const faults = minorFaults(pid) - faults0;
  const servicesCpuMs = ((cpuOfComm("postgres") + cpuOfComm("redis-server") - services0) * 1000) / lat.length;
  const gc1 = await gcOf(port);
  const client = process.cpuUsage(client0);
  const single: number[] = [];
  for (let i = 0; i < 3; i++) single.push((await uploadAs(0)).ms);
  return {
    lat, single, sentBytes,
    serverCpuMs: ((split1[0] + split1[1] - split0[0] - split0[1]) * 1000) / lat.length,
    serverSysMs: ((split1[1] - split0[1]) * 1000) / lat.length,
    faultsPerUpload: faults / lat.length,
    servicesCpuMs,
    poolMadeMiB: gc0 && gc1 ? ((gc1.poolMadeBytes ?? 0) - (gc0.poolMadeBytes ?? 0)) / 2 ** 20 : null,
    gc: gc0 && gc1 ? { major: (gc1.major - gc0.major) / lat.length, minor: (gc1.minor - gc0.minor) / lat.length, pauseMs: (gc1.pauseMs - gc0.pauseMs) / lat.length } : null,
    clientCpuMs: (client.user + client.system) / 1000 / lat.length,
  };
}

async function main(): Promise<void> {
  const useEnv = process.argv.includes("--use-env");
  const load0 = loadavg();
  let vars: string[] = [];
  if (!useEnv) {
    const services = spawn(process.execPath, ["scripts/test.mjs", "--services"], { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"] });
    children.push(services);
    const m = await waitLine(services, /export (PGPORT=.*)$/, "the test services");
    vars = m[1].trim().split(/\s+/);
  }
  await new Promise<void>((resolve, reject) => spawn("env", [...vars, process.execPath, "--import", "tsx", "scripts/migrate.ts"], { cwd: ROOT, stdio: "ignore" })
    .once("exit", (code) => (code === 0 ? resolve() : reject(new Error(`migrations failed (${code})`)))));
  const harness = process.argv.includes("--harness");
  // `next build` inherits this process's environment (PATH, HOME), as under `npm start`.
  // eslint-disable-next-line no-restricted-properties
  if (!harness) await buildIfNeeded(ROOT, { ...process.env, NEXT_TELEMETRY_DISABLED: "1" });
  const warmedGiB = process.argv.includes("--cold-memory") ? 0 : await warmMemory();
  const appVars = Object.entries(APP_PROCESS_ENV).map(([k, v]) => `${k}=${v}`);
  const server = spawnWith([...vars, ...appVars, "LOG_LEVEL=warn", "UPLOAD_RATE_LIMIT_PER_MINUTE=100000"], [...profFlags(), "--import", "tsx", "scripts/bench-ingest.ts", "--serve", ...(process.argv.includes("--node-body") ? ["--node-body"] : [])]);
  const ready = JSON.parse((await waitLine(server, /^READY (.*)$/, "the bench server"))[1]) as Ready;
  if (!harness) Object.assign(ready, await startNextApp(vars, appVars));
  process.stderr.write("stack ready; simulating the standard record…\n");
  const rec = standardRecord();
  let variant = 0;
  const upload = async (key: string, encoding: Encoding = "gzip") => {
    const v = ++variant;
    const payload = body(rec, `bench-${process.pid}-${v}`, v, encoding);
    const t0 = process.hrtime.bigint();
    const r = await send(ready.port, "POST", "/api/v1/records", key, payload);
    if (r.status !== 202) throw new Error(`upload answered ${r.status}: ${JSON.stringify(r.body)}`);
    return { id: r.body.record!.id, ms: ms(process.hrtime.bigint() - t0), bytes: byteLength(payload.pieces) };
  };

  // 1. Acceptance of the product's route, then of the bare-essentials floor (same record, same
  //    client), each with gzip and with plain float32 data.
  const fddIds: string[] = [];
  const product = async (encoding: Encoding) => {
    process.stderr.write(`acceptance (${encoding}): ${GATEWAYS} gateways × ${ROUNDS} uploads…\n`);
    return acceptance(ready.pid, ready.port, (gw) => upload(ready.fddKeys[gw], encoding).then((u) => {
      fddIds.push(u.id);
      return u;
    }));
  };
  const accGzip = await product("gzip");
  const accPlain = await product("plain");
  process.stderr.write("acceptance floor: receive, (gunzip,) check, SHA-256 and file write only…\n");
  const floorServer = spawnWith([...vars, ...appVars, "LOG_LEVEL=warn"], ["--import", "tsx", "scripts/bench-ingest.ts", "--serve-floor"]);
  const floorReady = JSON.parse((await waitLine(floorServer, /^READY (.*)$/, "the floor server"))[1]) as { port: number; pid: number };
  const floor = (encoding: Encoding) => acceptance(floorReady.pid, floorReady.port, async () => {
    const v = ++variant;
    const payload = { pieces: body(rec, `floor-${v}`, v, encoding).pieces.slice(1, 3), type: "application/octet-stream" };
    const t0 = process.hrtime.bigint();
    const r = await send(floorReady.port, "POST", "/floor", "", payload);
    if (r.status !== 202) throw new Error(`floor upload answered ${r.status}`);
    return { id: "", ms: ms(process.hrtime.bigint() - t0), bytes: byteLength(payload.pieces) };
  });
  const floorGzip = await floor("gzip");
  const floorPlain = await floor("plain");
  await stop(floorServer);
  const summary = (name: string, a: Awaited<ReturnType<typeof acceptance>>) =>
    `${name}: p50 ${median(a.lat).toFixed(0)} ms, p95 ${pct(a.lat, 95).toFixed(0)} ms, alone ${median(a.single).toFixed(0)} ms, server CPU ${a.serverCpuMs.toFixed(0)} ms/upload (kernel ${a.serverSysMs.toFixed(0)}), bench client CPU ${a.clientCpuMs.toFixed(0)} ms/upload, PostgreSQL + Redis CPU ${a.servicesCpuMs.toFixed(1)} ms/upload, server page faults ${a.faultsPerUpload.toFixed(0)}/upload, GC per upload ${a.gc ? `${a.gc.major.toFixed(2)} major ${a.gc.minor.toFixed(1)} minor ${a.gc.pauseMs.toFixed(1)} ms paused` : "n/a"}, pool buffers made ${a.poolMadeMiB ?? "n/a"} MiB`;

  if (process.argv.includes("--acceptance-only")) {
    for (const [name, a] of [["route gzip", accGzip], ["route plain", accPlain], ["floor gzip", floorGzip], ["floor plain", floorPlain]] as const) console.log(summary(name, a));
    console.log(`load ${loadavg().map((x) => x.toFixed(2)).join(" ")}`);
    return;
  }
  // 2. Throughput: one worker drains the backlog; SSI-COV records queued while no worker runs.
  process.stderr.write(`throughput: draining ${fddIds.length} FDD/EFDD records…\n`);
  const fdd = await drain(vars, fddIds);
  const ssiIds: string[] = [];
  for (let i = 0; i < SSI_RECORDS; i++) ssiIds.push((await upload(ready.ssiKey)).id);
  process.stderr.write(`throughput: draining ${ssiIds.length} FDD + SSI-COV records…\n`);
  const ssi = await drain(vars, ssiIds);

  // 3. Idle end-to-end: one record at a time, the gateway polls its record every 20 ms.
  const w = await startWorker(vars);
  const e2e: number[] = [];
  let spectral = "";
  for (let i = 0; i < IDLE_RUNS; i++) {
    const t0 = process.hrtime.bigint();
    const { id } = await upload(ready.fddKeys[1]);
    for (;;) {
      if (w.failure) throw new Error(`the worker failed a job: ${w.failure}`);
      const r = await send(ready.port, "GET", `/api/v1/records/${id}`, ready.fddKeys[1]);
      if (r.body.record?.status === "analysed") {
        const sp = r.body.analysis?.spectral;
        if (sp) spectral = `Welch segments of ${sp.nperseg} samples chosen by the engine for the lowest tracked band (${sp.averages} averages, ${sp.lineSpacingHz.toFixed(4)} Hz lines)`;
        break;
      }
      if (r.body.record?.status === "failed" || r.body.record?.status === "rejected") throw new Error(`record ${id} ${r.body.record.status}`);
      await new Promise((r2) => setTimeout(r2, 20));
    }
    e2e.push(ms(process.hrtime.bigint() - t0));
    await new Promise((r) => setTimeout(r, 300));
  }
  await stop(w.child);

  const load1 = loadavg();
  const row = (a: string, b: string, c: string) => `| ${a.padEnd(62)} | ${b.padStart(22)} | ${c.padEnd(12)} |`;
  console.log(`\nModewarden ingest bench — ${new Date().toISOString()}, Node ${process.version}, ${cpus().length} cores`);
  console.log(`load average before ${load0.map((x) => x.toFixed(2)).join(" ")}, after ${load1.map((x) => x.toFixed(2)).join(" ")}`);
  console.log(harness
    ? `upload path: loopback HTTP → a node:http harness ${process.argv.includes("--node-body") ? "handing the Node request stream to the ingest service (--harness --node-body)" : "wrapping the route handler of POST /api/v1/records (--harness)"}; not the built app`
    : "upload path: loopback HTTP → the built app (next start), POST /api/v1/records");
  console.log(warmedGiB ? `memory: ${warmedGiB.toFixed(2)} GiB touched by a throw-away process first (warmMemory)` : "memory: cold (--cold-memory)");
  console.log(`standard record: ${N_CH} ch × ${FS} Hz × ${DURATION_S} s float32 LE, ${(rec.rawBytes / 1e6).toFixed(2)} MB decoded; multipart ${(accGzip.sentBytes / 1e6).toFixed(2)} MB with gzip, ${(accPlain.sentBytes / 1e6).toFixed(2)} MB plain`);
  console.log(`acceptance: ${GATEWAYS} gateways at once, each uploading back to back (${ROUNDS} each, after a warm-up); "floor" = a bare server doing only`);
  console.log(`the contract's unavoidable work (pooled receive, gunzip, float32 check, SHA-256, blob write) with the same client`);
  console.log(`analysis: default settings v1 (FDD/EFDD) or + SSI-COV; ${spectral}\n`);
  console.log(row("measure", "value", "target"));
  console.log(row("-".repeat(62), "-".repeat(22), "-".repeat(12)));
  for (const [name, a, f] of [["gzip", accGzip, floorGzip], ["plain float32", accPlain, floorPlain]] as const) {
    console.log(row(`upload acceptance p50 / p95, ${name} (${a.lat.length} uploads)`, `${median(a.lat).toFixed(0)} / ${pct(a.lat, 95).toFixed(0)} ms`, "p95 ≤ 300 ms"));
    console.log(row(`  floor p50 / p95, ${name}`, `${median(f.lat).toFixed(0)} / ${pct(f.lat, 95).toFixed(0)} ms`, ""));
    console.log(row(`  one gateway alone (median of 3), ${name}`, `${median(a.single).toFixed(0)} ms`, ""));
    console.log(row(`  server CPU per upload (kernel), ${name}; floor`, `${a.serverCpuMs.toFixed(0)} (${a.serverSysMs.toFixed(0)}); ${f.serverCpuMs.toFixed(0)} ms`, ""));
  }
  console.log(row(`FDD/EFDD: records analysed per wall minute, 1 worker (${fddIds.length})`, `${fdd.perWallMin.toFixed(0)} (${fdd.msEach.toFixed(0)} ms each)`, "≥ 120/core"));
  console.log(row("FDD/EFDD: records per minute of worker CPU", fdd.perCpuMin.toFixed(0), "≥ 120/core"));
  console.log(row(`FDD + SSI-COV: records per wall minute, 1 worker (${ssiIds.length})`, `${ssi.perWallMin.toFixed(0)} (${ssi.msEach.toFixed(0)} ms each)`, ""));
  console.log(row("FDD + SSI-COV: records per minute of worker CPU", ssi.perCpuMin.toFixed(0), ""));
  console.log(row(`idle end-to-end upload → analysed, median (max) of ${IDLE_RUNS}`, `${median(e2e).toFixed(0)} (${Math.max(...e2e).toFixed(0)}) ms`, "≤ 2000 ms"));
}

/**
 * `--serve` (a child with the stack's environment): an organisation, an FDD/EFDD asset with
 * the 16 beam channels, its 3 tracked modes and GATEWAYS gateways, an FDD + SSI-COV asset with
 * one gateway; then a node:http server in front of the record routes. Prints `READY <json>`.
 */
async function runBenchServer(): Promise<void> {
  const [{ db, closeDb }, orgRepo, userRepo, memberRepo, { hashPassword }, assets, { createGateway }, { CreateAssetInput }, trackedRepo,
    settingsRepo, { DEFAULT_ANALYSIS_SETTINGS }, recordsRoute, recordRoute, { closeQueues }, { closeRateLimiter }] = await Promise.all([
    import("@/lib/db/knex"), import("@/lib/db/repos/organisation.repo"), import("@/lib/db/repos/user.repo"), import("@/lib/db/repos/membership.repo"),
    import("@/lib/auth/passwords"), import("@/lib/services/assets/asset.service"), import("@/lib/services/assets/gateway.service"),
    import("@/lib/services/assets/schemas"), import("@/lib/db/repos/tracked-mode.repo"), import("@/lib/db/repos/analysis-settings.repo"),
    import("@/lib/services/analysis/settings"), import("@/app/api/v1/records/route"), import("@/app/api/v1/records/[recordId]/route"),
    import("@/lib/jobs/queues"), import("@/lib/services/ingest/rate-limit"),
  ]);
  const tag = `${Date.now()}`;
  const org = await orgRepo.insertOrganisation(db(), { name: `Bench ${tag}`, timeZone: "America/Denver" });
  const passwordHash = await hashPassword(`bench-unused-${tag}`);
  const actorOf = async (role: "admin" | "engineer") => {
    const user = await userRepo.insertUser(db(), { email: `${role}-${tag}@bench.example`, passwordHash, displayName: `Bench ${role}` });
    await memberRepo.insertMembership(db(), { userId: user.id, organisationId: org.id, role });
    return { userId: user.id, organisationId: org.id, role, via: "session" as const };
  };
  const [admin, engineer] = [await actorOf("admin"), await actorOf("engineer")];
  const modes = simplySupportedBeamModes({ ...BENCH_BEAM, sensorPositionsM: benchSensorX(), modeCount: 3 });
  const makeAsset = async (name: string, gateways: number) => {
    const asset = await assets.createAsset(engineer, CreateAssetInput.parse({
      name: `${name} ${tag}`, kind: "footbridge", latitude: 39.2, longitude: -104.1, material: "Steel", mainDimensionM: 30, expectedIntervalMin: 10,
    }));
    for (const [i, code] of BENCH_CODES.entries()) await assets.addChannel(engineer, asset.id, { code, positionM: { x: benchSensorX()[i], y: 0, z: 0 }, direction: "z" });
    for (const [j, m] of modes.entries()) {
      await trackedRepo.insertTrackedMode(db(), asset.id, {
        label: `bending ${j + 1}`, nominalFrequencyHz: m.frequencyHz, bandLowHz: m.frequencyHz * 0.9, bandHighHz: m.frequencyHz * 1.1,
        referenceShape: Object.fromEntries(BENCH_CODES.map((c, i) => [c, m.shape[i]])),
      });
    }
    const keys: string[] = [];
    for (let i = 0; i < gateways; i++) keys.push((await createGateway(admin, asset.id, { name: `gw ${i + 1}` })).key);
    return { asset, keys };
  };
  const fdd = await makeAsset("Bench FDD", GATEWAYS);
  const ssi = await makeAsset("Bench SSI", 1);
  await settingsRepo.insertAnalysisSettingsVersion(db(), ssi.asset.id, { ...DEFAULT_ANALYSIS_SETTINGS, methods: ["fdd", "ssi"] }, null);

  const gcTotals = gcCounter();
  const [{ uploadBufferPool }, { deviceFromGatewayKey }, { ingestRecord }] = await Promise.all([
    import("@/lib/services/ingest/buffer-pool"), import("@/lib/services/assets/gateway.service"), import("@/lib/services/ingest/ingest.service"),
  ]);
  const nodeBody = process.argv.includes("--node-body");
  const server = createServer((req: IncomingMessage, res: ServerResponse) => {
    if (req.url === "/bench/gc") return void res.end(JSON.stringify({ ...gcTotals(), poolMadeBytes: uploadBufferPool().allocatedBytes }));
    void (async () => {
      const url = new URL(req.url ?? "/", "http://127.0.0.1");
      if (nodeBody && url.pathname === "/api/v1/records" && req.method === "POST") {
        // --node-body: the ingest service reads the Node request stream itself (no web-stream
        // Request), after the same key check; valid uploads only (anything else answers 500).
        const device = await deviceFromGatewayKey((req.headers.authorization ?? "").replace(/^Bearer /, ""));
        if (!device) throw new Error("unknown gateway key");
        const out = await ingestRecord(device, { body: req, contentType: req.headers["content-type"] ?? null, contentLength: Number(req.headers["content-length"]) });
        res.writeHead(202, { "content-type": "application/json" }).end(JSON.stringify({ record: { id: out.record.id, status: out.record.status } }));
        return;
      }
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
      const reqBody = req.method === "POST" ? (Readable.toWeb(req) as ReadableStream<Uint8Array>) : undefined;
      const request = new Request(url, { method: req.method, headers, body: reqBody, duplex: "half" } as RequestInit);
      const one = /^\/api\/v1\/records\/([^/]+)$/.exec(url.pathname);
      const response = url.pathname === "/api/v1/records" && req.method === "POST"
        ? await recordsRoute.POST(request, { params: Promise.resolve({}) })
        : one && req.method === "GET" ? await recordRoute.GET(request, { params: Promise.resolve({ recordId: one[1] }) }) : new Response("{}", { status: 404 });
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(Buffer.from(await response.arrayBuffer()));
    })().catch((e: unknown) => res.writeHead(500).end(String(e)));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  process.on("SIGTERM", () => {
    server.close();
    void Promise.all([closeQueues(), closeRateLimiter(), closeDb()]).finally(() => process.exit(0));
  });
  const ready: Ready = { port: (server.address() as AddressInfo).port, fddKeys: fdd.keys, ssiKey: ssi.keys[0], pid: process.pid };
  console.log(`READY ${JSON.stringify(ready)}`);
}

/**
 * `--serve-floor`: the least work any server must do to accept a standard record under the
 * upload contract, with the product's own pieces — the body read into a pooled buffer, gunzip,
 * the float32 check, SHA-256 and the blob write — and none of the rest (no multipart parsing,
 * authentication, rate limit, database or queue). Its latency bounds what the route can reach
 * on this machine. Prints `READY <json>`.
 */
async function runFloorServer(): Promise<void> {
  const [{ inflateIfGzip, checkAndHashSamples }, { contentKey }, { FsBlobStore }, { PooledBytes, uploadBufferPool }] = await Promise.all([
    import("@/lib/services/ingest/decode"), import("@/lib/storage/blob-store"), import("@/lib/storage/fs-blob-store"), import("@/lib/services/ingest/buffer-pool"),
  ]);
  const dir = mkdtempSync(path.join(tmpdir(), "mw-floor-"));
  const store = new FsBlobStore(dir);
  const gcTotals = gcCounter();
  const server = createServer((req: IncomingMessage, res: ServerResponse) => {
    if (req.url === "/bench/gc") return void res.end(JSON.stringify(gcTotals()));
    void (async () => {
      const body = new PooledBytes(uploadBufferPool(), Number(req.headers["content-length"] ?? 0));
      try {
        for await (const c of req) body.append(c as Buffer);
        const inflated = await inflateIfGzip(body.view(), "f32le", 256 * 1024 * 1024);
        try {
          const { sha256 } = await checkAndHashSamples(inflated.bytes, "f32le", BENCH_CODES);
          await store.put(contentKey(sha256), inflated.bytes);
        } finally {
          inflated.release();
        }
        res.writeHead(202).end("{}");
      } finally {
        body.release();
      }
    })().catch((e: unknown) => res.writeHead(500).end(JSON.stringify({ error: String(e) })));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  process.on("SIGTERM", () => {
    server.close();
    rmSync(dir, { recursive: true, force: true });
    process.exit(0);
  });
  console.log(`READY ${JSON.stringify({ port: (server.address() as AddressInfo).port, pid: process.pid })}`);
}

async function shutdown(): Promise<void> {
  agent.destroy();
  for (const c of [...children].reverse()) await stop(c).catch(() => undefined);
}

if (process.argv.includes("--serve")) {
  void runBenchServer();
} else if (process.argv.includes("--serve-floor")) {
  void runFloorServer();
} else {
  for (const s of ["SIGINT", "SIGTERM"] as const) process.on(s, () => void shutdown().then(() => process.exit(130)));
  main().then(shutdown, async (e: unknown) => {
    console.error(e instanceof Error ? e.stack : String(e));
    await shutdown();
    process.exitCode = 1;
  });
}
