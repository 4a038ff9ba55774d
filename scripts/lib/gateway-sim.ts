/**
 * The simulated gateway's work, shared by `npm run gateway:simulate` (scripts/gateway-simulate.ts)
 * and the launcher's fresh demo records (scripts/demo-fresh-records.ts): ask the server what the
 * gateway may know (GET /api/v1/gateways/me: active channels and tracked modes), simulate
 * ambient records for that channel layout with lib/simulate, and upload each as the contract
 * says (multipart: meta JSON + float32 LE data).
 *
 * Mode shapes: a tracked mode's reference shape when it has one, else a smooth shape over the
 * channel positions (half-sine orders along the asset's longest extent).
 */
import { applyDefects, createRng, simulateAmbientRecord, type RecordDefect, type SimulatedMode } from "@/lib/simulate";

export class UsageError extends Error {}
/** The server refused the key (GET /gateways/me was not 200). */
export class GatewayRefusedError extends Error {}

export interface GatewaySelf {
  asset: { id: string; name: string };
  channels: { code: string; positionM: { x: number; y: number; z: number }; quantity: string }[];
  trackedModes: { label: string; nominalFrequencyHz: number; referenceShape: Record<string, number> | null }[];
}

export interface SimulationOptions {
  url: string;
  key: string;
  count: number;
  intervalS: number;
  durationS: number;
  rateHz: number;
  seed: number;
  /** Mode frequencies (Hz) instead of the tracked modes'. */
  modesHz?: number[];
  /** Frequency of a tracked mode in this record (default: its nominal frequency). */
  trackedModeFrequencyHz?: (mode: { label: string; nominalFrequencyHz: number }) => number;
  /** Temperature reported with each record (°C; default: a daily cycle around 12 °C). */
  temperatureC?: (startedAt: Date) => number;
  /** `kind[:code],…` (flatLine, spikes, gap, clip, hum). */
  defects?: string;
  /** Called after each upload with the server's answer. */
  onAnswer?: (answer: UploadAnswer) => void;
}

export interface UploadAnswer { n: number; recordId: string; status: number; ms: number; body: unknown }

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

/**
 * Simulate and upload `count` records for the gateway's asset.
 * @throws GatewayRefusedError when the server refuses the key; UsageError for options that do not fit the asset.
 */
export async function runGatewaySimulation(o: SimulationOptions): Promise<{ self: GatewaySelf; answers: UploadAnswer[] }> {
  const base = o.url.replace(/\/$/, "");
  const auth = { authorization: `Bearer ${o.key}` };
  const me = await fetch(`${base}/api/v1/gateways/me`, { headers: auth });
  if (!me.ok) throw new GatewayRefusedError(`GET /api/v1/gateways/me answered ${me.status}: ${await me.text()}`);
  const self = (await me.json()) as GatewaySelf;
  const accel = self.channels.filter((c) => c.quantity === "acceleration");
  if (accel.length === 0) throw new UsageError(`asset ${self.asset.name} has no active acceleration channel`);
  const codes = accel.map((c) => c.code);
  const freqs = o.modesHz ?? self.trackedModes.map((m) => o.trackedModeFrequencyHz?.(m) ?? m.nominalFrequencyHz);
  if (freqs.length === 0) throw new UsageError("the asset has no tracked modes: pass --modes f1,f2,… (Hz)");
  const modes: SimulatedMode[] = freqs.map((f, j) => {
    const ref = o.modesHz ? null : self.trackedModes[j].referenceShape;
    const shape = ref && codes.every((c) => Number.isFinite(ref[c])) ? codes.map((c) => ref[c]) : genericShape(j + 1, accel.map((c) => c.positionM));
    return { frequencyHz: f, dampingRatio: 0.01, shape };
  });
  const defects = parseDefects(o.defects, codes, o.durationS);
  const fs = o.rateHz;
  const answers: UploadAnswer[] = [];
  for (let i = 0; i < o.count; i++) {
    const startedAt = new Date(Date.now() - o.durationS * 1000);
    let { data } = simulateAmbientRecord({ modes, sampleRateHz: fs, durationS: o.durationS, seed: o.seed + i });
    if (defects.length) data = applyDefects(data, fs, defects, createRng(o.seed + i)).data;
    const meta = {
      recordId: `sim-${startedAt.toISOString().replace(/[:.]/g, "")}-${o.seed + i}`, startedAt: startedAt.toISOString(), sampleRateHz: fs,
      channels: codes, units: "m/s2", temperatureC: o.temperatureC?.(startedAt) ?? Math.round((12 + 8 * Math.sin((2 * Math.PI * startedAt.getUTCHours()) / 24)) * 10) / 10,
    };
    const form = new FormData();
    form.append("meta", JSON.stringify(meta));
    form.append("data", new Blob([f32le(data)], { type: "application/octet-stream" }), "record.f32");
    const t0 = performance.now();
    const res = await fetch(`${base}/api/v1/records`, { method: "POST", headers: auth, body: form });
    const body: unknown = await res.json().catch(() => null);
    const answer = { n: i + 1, recordId: meta.recordId, status: res.status, ms: Math.round(performance.now() - t0), body };
    answers.push(answer);
    o.onAnswer?.(answer);
    if (i + 1 < o.count && o.intervalS > 0) await new Promise((r) => setTimeout(r, o.intervalS * 1000));
  }
  return { self, answers };
}
