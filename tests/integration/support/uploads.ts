/**
 * Builders for the upload and analysis integration tests: an asset with a four-channel
 * layout and a gateway, record bodies (CSV / float32, optionally gzip), multipart requests
 * as a gateway sends them, and counters of what an upload leaves behind.
 */
import { readdir } from "node:fs/promises";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { db } from "@/lib/db/knex";
import { insertTrackedMode } from "@/lib/db/repos/tracked-mode.repo";
import type { TrackedMode } from "@/lib/domain/records";
import type { Asset } from "@/lib/domain/types";
import { getAnalysisQueue } from "@/lib/jobs/analysis";
import { addChannel, createAsset } from "@/lib/services/assets/asset.service";
import { createGateway } from "@/lib/services/assets/gateway.service";
import { CreateAssetInput } from "@/lib/services/assets/schemas";
import type { RecordJson } from "@/lib/domain/records";
import type { RecordView } from "@/lib/services/ingest/record.service";
import type { HeartbeatAnswer } from "@/lib/services/ingest/heartbeat.service";
import { blobRoot } from "@/lib/storage";
import { makeTeam, unique, validAsset } from "./factories";

export const CHANNELS = ["F1", "F2", "F3", "F4"];

export type Team = Awaited<ReturnType<typeof makeTeam>>;
export interface GatewaySetup { team: Team; asset: Asset; key: string; gatewayId: string }

/** A team, an asset with channels F1–F4 (one per floor, x direction) and one gateway. */
export async function makeGatewayAsset(team?: Team): Promise<GatewaySetup> {
  const t = team ?? (await makeTeam());
  const asset = await createAsset(t.engineer.actor, CreateAssetInput.parse({ ...validAsset(), kind: "tower" }));
  for (const [i, code] of CHANNELS.entries()) {
    await addChannel(t.engineer.actor, asset.id, { code, positionM: { x: 0, y: 0, z: 3 * (i + 1) }, direction: "x" });
  }
  const { gateway, key } = await createGateway(t.admin.actor, asset.id, { name: unique("gw") });
  return { team: t, asset, key, gatewayId: gateway.id };
}

export async function addTrackedMode(assetId: string, label: string, f0: number, halfBand: number, shape: number[] | null): Promise<TrackedMode> {
  return insertTrackedMode(db(), assetId, {
    label, nominalFrequencyHz: f0, bandLowHz: f0 * (1 - halfBand), bandHighHz: f0 * (1 + halfBand),
    referenceShape: shape ? Object.fromEntries(CHANNELS.map((c, i) => [c, shape[i]])) : null,
  });
}

/** CSV text as the contract describes it: header of codes, one row per sample. */
export function csvOf(channels: string[], data: ArrayLike<number>[]): string {
  const lines = [channels.join(",")];
  for (let k = 0; k < data[0].length; k++) lines.push(data.map((x) => String(x[k])).join(","));
  return `${lines.join("\n")}\n`;
}

/** float32 little-endian, interleaved sample by sample. */
export function f32Of(data: ArrayLike<number>[]): Buffer {
  const n = data[0].length;
  const buf = Buffer.alloc(4 * n * data.length);
  for (let k = 0, o = 0; k < n; k++) for (const x of data) { buf.writeFloatLE(x[k], o); o += 4; }
  return buf;
}

export const gzip = (b: Buffer | string) => gzipSync(typeof b === "string" ? Buffer.from(b) : b);

/** A deterministic noise-like record (no structure needed for contract tests). */
export function noiseRecord(n: number, phase = 0, channels = CHANNELS.length): Float64Array[] {
  return Array.from({ length: channels }, (_, c) => Float64Array.from({ length: n }, (_, k) => Math.round(1e4 * Math.sin(0.37 * k * (c + 1) + c + phase) * Math.cos(0.011 * k)) / 1e6));
}

export function metaOf(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    recordId: unique("rec"), startedAt: "2026-03-01T12:00:00Z", sampleRateHz: 100, channels: CHANNELS, units: "m/s2",
    temperatureC: 8.5, environment: { windSpeedMps: 3.2, humidityPct: 71 }, ...overrides,
  };
}

export interface UploadSpec {
  key?: string;
  meta?: unknown;
  /** Raw text used as the meta part instead of JSON.stringify(meta). */
  metaText?: string;
  data?: Buffer | string;
  type?: string;
  filename?: string;
  extraParts?: [string, string][];
}

/** A multipart POST as a gateway sends it (meta as a field, data as a file part). */
export function uploadRequest(spec: UploadSpec): Request {
  const fd = new FormData();
  if (spec.metaText !== undefined || spec.meta !== undefined) fd.append("meta", spec.metaText ?? JSON.stringify(spec.meta));
  if (spec.data !== undefined) {
    const bytes = typeof spec.data === "string" ? Buffer.from(spec.data) : spec.data;
    fd.append("data", new Blob([new Uint8Array(bytes)], { type: spec.type ?? "text/csv" }), spec.filename ?? "record.csv");
  }
  for (const [k, v] of spec.extraParts ?? []) fd.append(k, v);
  const headers: Record<string, string> = {};
  if (spec.key) headers.authorization = `Bearer ${spec.key}`;
  return new Request("http://127.0.0.1/api/v1/records", { method: "POST", headers, body: fd });
}

type Handler = (req: Request, ctx?: { params: Promise<Record<string, string | string[] | undefined>> }) => Promise<Response>;

/** The JSON answers of the record and heartbeat routes. */
export interface ApiBody extends Partial<RecordView> {
  record?: RecordJson;
  heartbeat?: HeartbeatAnswer;
  error?: { code: string; message: string; details: Record<string, unknown> };
}

export async function send(handler: Handler, req: Request, params: Record<string, string> = {}) {
  const res = await handler(req, { params: Promise.resolve(params) });
  const text = await res.text();
  return { status: res.status, headers: res.headers, body: (text ? JSON.parse(text) : {}) as ApiBody };
}

/** What an upload may leave behind: rows of the gateway, blob files, analysis jobs. */
export async function footprint(gatewayId: string): Promise<{ rows: number; blobs: number; jobs: number }> {
  const row = await db()("records").where({ gateway_id: gatewayId }).count<{ n: string }[]>({ n: "*" }).first();
  const counts = await getAnalysisQueue().getJobCounts("waiting", "active", "delayed", "completed", "failed", "prioritized");
  return { rows: Number(row?.n ?? 0), blobs: await countFiles(blobRoot()), jobs: Object.values(counts).reduce((a, b) => a + b, 0) };
}

async function countFiles(dir: string): Promise<number> {
  let entries;
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return 0;
  }
  let n = 0;
  for (const e of entries) n += e.isDirectory() ? await countFiles(path.join(dir, e.name)) : 1;
  return n;
}
