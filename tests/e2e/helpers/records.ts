/**
 * Simulated records for the browser tests: made with lib/simulate from an invented modal
 * model on a demo asset's channel layout, uploaded through the gateway API with the demo
 * gateway key (float32 little-endian, interleaved: the upload contract), then polled until the
 * e2e stage's real worker has analysed them.
 */
import type { DemoAsset } from "@/db/seeds/larkspur/data";
import { simulateAmbientRecord } from "@/lib/simulate";
import { appUrl } from "./browser";

export interface ChannelAt { code: string; x: number; direction: string }
export interface SimulatedMode { frequencyHz: number; dampingRatio: number; shape: (c: ChannelAt) => number }
export interface RecordState { status: string; analysedSettingsVersion: number | null; failureReason: string | null }

function f32Of(data: Float64Array[]): Blob {
  const n = data[0].length;
  const out = new Float32Array(n * data.length);
  for (let k = 0; k < n; k++) for (let c = 0; c < data.length; c++) out[k * data.length + c] = data[c][k];
  return new Blob([out.buffer], { type: "application/octet-stream" });
}

/** Upload one simulated record of `asset` (started `agoMin` minutes ago); returns its id. */
export async function uploadSimulatedRecord(key: string, asset: DemoAsset, o: {
  modes: SimulatedMode[]; sampleRateHz: number; durationS: number; temperatureC: number; idPrefix: string; agoMin: number;
}): Promise<string> {
  const layout: ChannelAt[] = asset.channels.map((c) => ({ code: c.code, x: c.positionM.x, direction: c.direction }));
  const rec = simulateAmbientRecord({
    modes: o.modes.map((m) => ({ frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, shape: layout.map(m.shape) })),
    sampleRateHz: o.sampleRateHz, durationS: o.durationS, seed: Date.now() % 100000,
  });
  const form = new FormData();
  form.set("meta", new Blob([JSON.stringify({
    recordId: `${o.idPrefix}-${Date.now()}`, startedAt: new Date(Date.now() - o.agoMin * 60_000).toISOString(), sampleRateHz: o.sampleRateHz,
    channels: layout.map((c) => c.code), units: "m/s2", temperatureC: o.temperatureC,
  })], { type: "application/json" }));
  form.set("data", f32Of(rec.data), "record.f32");
  const res = await fetch(`${appUrl()}/api/v1/records`, { method: "POST", headers: { authorization: `Bearer ${key}` }, body: form });
  const body = (await res.json()) as { record?: { id: string } };
  if (res.status !== 202 || !body.record) throw new Error(`upload answered ${res.status}: ${JSON.stringify(body)}`);
  return body.record.id;
}

/** Poll `GET /api/v1/records/:id` as the sending gateway until `done` holds; fails on a failed or rejected record. */
export async function waitForRecord(key: string, id: string, done: (r: RecordState) => boolean): Promise<RecordState> {
  for (let i = 0; i < 120; i++) {
    const res = await fetch(`${appUrl()}/api/v1/records/${id}`, { headers: { authorization: `Bearer ${key}` } });
    const { record } = (await res.json()) as { record: RecordState };
    if (done(record)) return record;
    if (record.status === "failed" || record.status === "rejected") throw new Error(`record ${record.status}: ${record.failureReason}`);
    await new Promise((r) => setTimeout(r, 1000));
  }
  throw new Error("the record did not reach the expected state within 120 polls");
}
