/**
 * A simulated gateway: asks the server what it is allowed to know (GET /api/v1/gateways/me with
 * its key: the asset's active channels and tracked modes), simulates ambient records with the
 * engine's simulator for that channel layout, and uploads each over HTTP as the contract says
 * (multipart: meta JSON + float32 LE data), printing every answer as one JSON line.
 *
 *   npm run gateway:simulate -- --key <gateway key> [--url http://127.0.0.1:3000] [--count N]
 *     [--interval-s S] [--duration-s 600] [--rate-hz 100] [--seed 1] [--modes 2.1,5.8]
 *     [--defects flatLine:A3,spikes,gap,clip,hum]
 *
 * Mode shapes: a tracked mode's reference shape when it has one, else a smooth shape over the
 * channel positions (half-sine orders along the asset's longest extent). Without tracked modes,
 * pass --modes (Hz). Exit code 2 for bad usage, 1 when the server refuses the key.
 */
import { applyDefects, createRng, simulateAmbientRecord, type RecordDefect, type SimulatedMode } from "@/lib/simulate";

class UsageError extends Error {}

const USAGE = "usage: npm run gateway:simulate -- --key <key> [--url URL] [--count N] [--interval-s S] [--duration-s S] [--rate-hz Hz] [--seed N] [--modes f1,f2] [--defects kind[:code],...]";
const KEYS = ["key", "url", "count", "interval-s", "duration-s", "rate-hz", "seed", "modes", "defects"];

interface Self {
  asset: { id: string; name: string };
  channels: { code: string; positionM: { x: number; y: number; z: number }; quantity: string }[];
  trackedModes: { label: string; nominalFrequencyHz: number; referenceShape: Record<string, number> | null }[];
}

function parseArgs(argv: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const [key, inline] = argv[i].replace(/^--/, "").split("=", 2);
    if (!argv[i].startsWith("--") || !KEYS.includes(key)) throw new UsageError(`unknown argument ${argv[i]}`);
    const value = inline ?? argv[++i];
    if (value === undefined) throw new UsageError(`--${key} needs a value`);
    out[key] = value;
  }
  if (!out.key) throw new UsageError("--key is required");
  return out;
}

function num(v: string | undefined, fallback: number, name: string, min: number): number {
  if (v === undefined) return fallback;
  const n = Number(v);
  if (!Number.isFinite(n) || n < min) throw new UsageError(`--${name} must be a number ≥ ${min} (got ${v})`);
  return n;
}

/** Half-sine shapes of increasing order along the channels' longest extent (a generic slender structure). */
function genericShape(order: number, positions: { x: number; y: number; z: number }[]): number[] {
  const axes = (["x", "y", "z"] as const).map((k) => {
    const v = positions.map((p) => p[k]);
    return { k, lo: Math.min(...v), span: Math.max(...v) - Math.min(...v) };
  }).sort((a, b) => b.span - a.span);
  const { k, lo, span } = axes[0];
  return positions.map((p, i) => (span > 0 ? Math.sin(order * Math.PI * (0.1 + 0.8 * (p[k] - lo) / span)) : Math.cos(i + order)));
}

function parseDefects(spec: string | undefined, codes: string[], durationS: number): RecordDefect[] {
  if (!spec) return [];
  return spec.split(",").map((item) => {
    const [kind, code] = item.split(":");
    const idx = code === undefined ? 0 : codes.indexOf(code);
    if (idx < 0) throw new UsageError(`--defects: no channel ${code} (channels: ${codes.join(", ")})`);
    const channels = [idx];
    switch (kind) {
      case "flatLine": return { kind, channels, value: 0 };
      case "spikes": return { kind, channels, count: 20, amplitude: 0.5 };
      case "gap": return { kind, channels, startS: durationS / 3, durationS: 5, fill: "zero" };
      case "clip": return { kind, channels, fullScale: 0.002 };
      case "hum": return { kind, channels, frequencyHz: 50, amplitude: 0.01 };
      default: throw new UsageError(`--defects: unknown kind ${kind} (flatLine, spikes, gap, clip, hum)`);
    }
  });
}

function f32le(data: Float64Array[]): ArrayBuffer {
  const n = data[0].length;
  const view = new DataView(new ArrayBuffer(4 * n * data.length));
  for (let k = 0, o = 0; k < n; k++) for (const x of data) { view.setFloat32(o, x[k], true); o += 4; }
  return view.buffer;
}

async function main(): Promise<number> {
  let a: Record<string, string>;
  try {
    a = parseArgs(process.argv.slice(2));
  } catch (e) {
    process.stderr.write(`${(e as Error).message}\n${USAGE}\n`);
    return 2;
  }
  const base = (a.url ?? "http://127.0.0.1:3000").replace(/\/$/, "");
  const auth = { authorization: `Bearer ${a.key}` };
  const me = await fetch(`${base}/api/v1/gateways/me`, { headers: auth });
  if (!me.ok) {
    process.stderr.write(`GET /api/v1/gateways/me answered ${me.status}: ${await me.text()}\n`);
    return 1;
  }
  const self = (await me.json()) as Self;
  try {
    const count = num(a.count, 1, "count", 1);
    const intervalS = num(a["interval-s"], 0, "interval-s", 0);
    const durationS = num(a["duration-s"], 600, "duration-s", 1);
    const fs = num(a["rate-hz"], 100, "rate-hz", 1);
    const seed = num(a.seed, Date.now() % 1e6, "seed", 0);
    const accel = self.channels.filter((c) => c.quantity === "acceleration");
    if (accel.length === 0) throw new UsageError(`asset ${self.asset.name} has no active acceleration channel`);
    const codes = accel.map((c) => c.code);
    const freqs = a.modes ? a.modes.split(",").map((f) => num(f, 0, "modes", 0.01)) : self.trackedModes.map((m) => m.nominalFrequencyHz);
    if (freqs.length === 0) throw new UsageError("the asset has no tracked modes: pass --modes f1,f2,… (Hz)");
    const modes: SimulatedMode[] = freqs.map((f, j) => {
      const ref = a.modes ? null : self.trackedModes[j].referenceShape;
      const shape = ref && codes.every((c) => Number.isFinite(ref[c])) ? codes.map((c) => ref[c]) : genericShape(j + 1, accel.map((c) => c.positionM));
      return { frequencyHz: f, dampingRatio: 0.01, shape };
    });
    const defects = parseDefects(a.defects, codes, durationS);
    for (let i = 0; i < count; i++) {
      const startedAt = new Date(Date.now() - durationS * 1000);
      let { data } = simulateAmbientRecord({ modes, sampleRateHz: fs, durationS, seed: seed + i });
      if (defects.length) data = applyDefects(data, fs, defects, createRng(seed + i)).data;
      const meta = {
        recordId: `sim-${startedAt.toISOString().replace(/[:.]/g, "")}-${seed + i}`, startedAt: startedAt.toISOString(), sampleRateHz: fs,
        channels: codes, units: "m/s2", temperatureC: Math.round((12 + 8 * Math.sin((2 * Math.PI * startedAt.getUTCHours()) / 24)) * 10) / 10,
      };
      const form = new FormData();
      form.append("meta", JSON.stringify(meta));
      form.append("data", new Blob([f32le(data)], { type: "application/octet-stream" }), "record.f32");
      const t0 = performance.now();
      const res = await fetch(`${base}/api/v1/records`, { method: "POST", headers: auth, body: form });
      const body: unknown = await res.json().catch(() => null);
      process.stdout.write(`${JSON.stringify({ n: i + 1, recordId: meta.recordId, status: res.status, ms: Math.round(performance.now() - t0), body })}\n`);
      if (i + 1 < count && intervalS > 0) await new Promise((r) => setTimeout(r, intervalS * 1000));
    }
    return 0;
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n${USAGE}\n`);
      return 2;
    }
    throw e;
  }
}

void main().then((code) => {
  process.exitCode = code;
});
