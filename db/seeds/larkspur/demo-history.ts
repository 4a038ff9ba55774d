/**
 * About a year of analysed demo history per Larkspur asset (issue 4 §8), computed from the
 * assets' modal models (./demo-modal.ts) instead of raw records, so seeding stays quick:
 * one record every 6 hours, each with an analysis result whose identified modes are the model's
 *   f = f₂₀(T) · √(stiffness factor) · (1 + ε),  ε ~ N(0, 0.3 %) (estimation noise)
 * (f₂₀(T) by lib/simulate's frequencyAtTemperature; a stiffness factor k scales every frequency
 * by √k since f ∝ √(k/m) [pub: Chopra, Dynamics of Structures, SDOF chapter]), damping with
 * log-normal scatter, shapes with small noise and MAC to the tracked reference; each record
 * also carries a reported wind speed and per-channel response levels (demo values).
 *
 * Demo rows are marked: gateway record ids start with `demo-history-`, the result carries a
 * warning saying so, and the record stores no raw data (blob key `demo-history/none`, a
 * deterministic placeholder hash); the result carries a small display spectrum so the
 * Record page has something to draw. Idempotent: ids derive from the asset and the slot time,
 * slots already present are skipped, inserts ignore conflicts.
 */
import { createHash } from "node:crypto";
import type { Knex } from "knex";
import { createRng, frequencyAtTemperature, type Rng } from "../../../lib/simulate";
import { NO_RAW_SAMPLES_BLOB_KEY } from "../../../lib/domain/records";
import { DEFAULT_ANALYSIS_SETTINGS } from "../../../lib/services/analysis/settings";
import { DEMO_ORGANISATION } from "../demo-users";
import { DEMO_ASSETS, type DemoAsset } from "./data";
import { demoModels, siteTemperatureC, type DemoAssetModel } from "./demo-modal";

export const DEMO_HISTORY_PREFIX = "demo-history-";
export const DEMO_HISTORY_WARNING = "Demo history: identified from the asset's modal model with estimation noise; no raw samples are stored for this record.";
const SLOT_MS = 6 * 3_600_000;
const DAY_MS = 86_400_000;
const SAMPLE_RATE_HZ = 100;
const DURATION_S = 600;
const NPERSEG = 16384;
/** Welch averages at 50 % overlap over one record. */
const AVERAGES = Math.floor((SAMPLE_RATE_HZ * DURATION_S - NPERSEG) / (NPERSEG / 2)) + 1;
const CHUNK = 500;

export interface DemoHistoryOptions {
  /** End of the history (default now); the last slot is the last 6-hour mark before it. */
  now?: Date;
  /** Length in days (default 365). */
  days?: number;
}

/** A UUID-shaped id from a name (version nibble 4, variant 8): stable across runs. */
export function stableId(name: string): string {
  const h = createHash("sha256").update(name).digest("hex");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

const seedOf = (name: string) => createHash("sha256").update(name).digest().readUInt32LE(0);
const r4 = (x: number) => Number(x.toPrecision(4));

/** Slot start times (ms) of the history, oldest first, for an asset offset by a few minutes. */
export function demoSlots(now: Date, days: number, offsetMin: number): number[] {
  const offset = offsetMin * 60_000;
  const last = Math.floor((now.getTime() - offset - DURATION_S * 1000) / SLOT_MS) * SLOT_MS + offset;
  const n = Math.round((days * DAY_MS) / SLOT_MS);
  return Array.from({ length: n }, (_, i) => last - (n - 1 - i) * SLOT_MS);
}

function macReal(a: number[], b: number[]): number {
  let ab = 0, aa = 0, bb = 0;
  for (let i = 0; i < a.length; i++) { ab += a[i] * b[i]; aa += a[i] * a[i]; bb += b[i] * b[i]; }
  return aa > 0 && bb > 0 ? (ab * ab) / (aa * bb) : 0;
}

interface Rows { records: object[]; results: object[]; modes: object[]; assignments: object[]; levels: object[] }

function displaySpectrum(freqs: { f: number; zeta: number; amp: number }[], fMax: number, rng: Rng) {
  // A coarse uniform grid plus lines around each peak (±4 half-power half-widths) so peaks stay sharp.
  const grid = Array.from({ length: 96 }, (_, i) => (fMax * (i + 1)) / 96);
  for (const m of freqs) for (let k = -4; k <= 4; k++) grid.push(m.f * (1 + k * m.zeta));
  grid.sort((a, b) => a - b);
  const frequencyHz: number[] = [], s1: number[] = [];
  for (const f of grid) {
    if (f <= 0 || f > fMax) continue;
    let s = 2e-9 * (1 + 0.3 * Math.abs(rng.normal()));
    for (const m of freqs) {
      const r = f / m.f;
      s += (m.amp * 1e-7) / ((1 - r * r) ** 2 + (2 * m.zeta * r) ** 2);
    }
    frequencyHz.push(r4(f));
    s1.push(r4(s));
  }
  return { frequencyHz, s1, s2: null, s3: null };
}

function historyRows(asset: DemoAsset, model: DemoAssetModel, tracked: Map<string, string>, slots: number[], nowMs: number): Rows {
  const out: Rows = { records: [], results: [], modes: [], assignments: [], levels: [] };
  const codes = asset.channels.map((c) => c.code);
  const fMax = Math.min(SAMPLE_RATE_HZ / 2, Math.max(...model.modes.map((m) => m.f20)) * 1.6);
  for (const at of slots) {
    const startedAt = new Date(at);
    const gatewayRecordId = `${DEMO_HISTORY_PREFIX}${startedAt.toISOString()}`;
    const recordId = stableId(`record:${asset.id}:${gatewayRecordId}`);
    const resultId = stableId(`result:${recordId}:1`);
    const rng = createRng(seedOf(recordId));
    const temperatureC = siteTemperatureC(startedAt);
    const ageDays = (nowMs - at) / DAY_MS;
    const stiffness = model.damage && ageDays <= model.damage.days ? model.damage.stiffnessFactor : 1;
    const flat = model.flatLine && ageDays <= model.flatLine.days ? model.flatLine.channel : null;
    const used = codes.filter((c) => c !== flat);
    const doneAt = new Date(at + DURATION_S * 1000 + 1500 + Math.floor(rng.next() * 2000));

    const identified: { f: number; zeta: number; amp: number; trackedId: string; mac: number; dev: number; row: Record<string, unknown> }[] = [];
    for (const m of model.modes) {
      if (rng.next() > m.identifyRate) continue;
      const f = frequencyAtTemperature(m.f20, Math.max(-60, Math.min(80, temperatureC)), model.sensitivity) * Math.sqrt(stiffness) * (1 + 0.003 * rng.normal());
      const zeta = m.damping * Math.exp(0.3 * rng.normal());
      const ref = used.map((c) => m.shape[c]);
      const noisy = ref.map((v) => v + 0.03 * rng.normal());
      const max = Math.max(...noisy.map(Math.abs));
      const shape = noisy.map((v) => r4(v / max));
      const im = used.map(() => r4(0.02 * rng.normal()));
      const mac = macReal(ref, shape);
      const nominal = m.f20;
      identified.push({
        f, zeta, amp: 0.5 + rng.next(), trackedId: tracked.get(m.label) as string, mac, dev: (f - nominal) / nominal,
        row: {
          frequency_hz: Number(f.toFixed(4)), damping_ratio: Number(zeta.toFixed(5)), damping_method: "efdd",
          damping_reliable: (2 * zeta * f * NPERSEG) / SAMPLE_RATE_HZ >= 3, mpc: Number((0.93 + 0.065 * rng.next()).toFixed(4)),
          shape: JSON.stringify(Object.fromEntries(used.map((c, i) => [c, shape[i]]))),
          shape_complex: JSON.stringify({ re: Object.fromEntries(used.map((c, i) => [c, shape[i]])), im: Object.fromEntries(used.map((c, i) => [c, im[i]])) }),
          estimates: JSON.stringify({
            fdd: { peakFrequencyHz: Number(f.toFixed(3)) }, efdd: { frequencyHz: Number(f.toFixed(4)), dampingRatio: Number(zeta.toFixed(5)) },
            reliability: { bandwidthLines: Number(((2 * zeta * f * NPERSEG) / SAMPLE_RATE_HZ).toFixed(2)), cyclesInRecord: Math.round(f * DURATION_S) },
            demo: true,
          }),
          possibly_coupled: false,
        },
      });
    }
    identified.sort((a, b) => a.f - b.f);

    // Wind and deck/top response levels from their own generator, so the modal draws above
    // (and Heron Reach's drift) do not change. Demo values: a few m/s of wind, ambient levels
    // of a few cm/s² on the decks, and now and then a narrow-band cross-wind episode on the
    // towers when the wind is near their critical speed.
    const wr = createRng(seedOf(`wind:${recordId}`));
    const windSpeedMps = Number(Math.max(0.2, 3.2 + 1.8 * wr.normal()).toFixed(1));
    const tower = asset.kind === "mast" || asset.kind === "tower";
    const lockIn = tower && Math.abs(windSpeedMps - 3.7) < 0.5 && wr.next() < 0.15;
    const base = tower ? 0.01 : asset.name.startsWith("Heron") ? 0.12 : 0.05;
    const levels = used.map((c) => {
      const axis = (asset.channels.find((x) => x.code === c)?.direction ?? "z").replace("-", "");
      const rms = base * (axis === "z" ? 1 : 0.4) * (0.5 + wr.next()) * (lockIn && axis !== "z" ? 5 : 1);
      const crest = lockIn && axis !== "z" ? 1.5 : 3.5 + 0.8 * wr.next();
      return { code: c, axis, peakMps2: r4(rms * crest), maxRms1sMps2: r4(rms * 1.8), rmsMps2: r4(rms) };
    });
    out.levels.push({ record_id: recordId, levels: JSON.stringify(levels) });

    out.records.push({
      id: recordId, organisation_id: DEMO_ORGANISATION.id, asset_id: asset.id, gateway_id: asset.gateway.id, gateway_record_id: gatewayRecordId,
      started_at: startedAt, sample_rate_hz: SAMPLE_RATE_HZ, channels: codes, units: "m/s2", temperature_c: temperatureC,
      environment: JSON.stringify({ windSpeedMps }), content_hash: createHash("sha256").update(`demo-history:${recordId}`).digest("hex"),
      blob_key: NO_RAW_SAMPLES_BLOB_KEY, data_format: "f32le", byte_size: 4 * codes.length * SAMPLE_RATE_HZ * DURATION_S,
      sample_count: SAMPLE_RATE_HZ * DURATION_S, duration_s: DURATION_S, status: "analysed", progress: 1, analysed_settings_version: 1,
      created_at: new Date(at + DURATION_S * 1000 + 400), updated_at: doneAt,
    });
    const channels = codes.map((c) => ({
      channel: c, flags: c === flat ? ["flat_line"] : [], rms: c === flat ? 0 : r4(2e-3 * (0.6 + rng.next())), nonFiniteCount: 0, longestGapSamples: 0,
      clippedSamples: 0, longestFlatRunSamples: c === flat ? SAMPLE_RATE_HZ * DURATION_S : 1, spikeCount: 0, humHz: [],
      notes: c === flat ? [`${c}: the signal is flat for the whole record (sensor or cable fault).`] : [],
    }));
    const verdict = flat ? { kind: "accept_without", channels: [flat] } : { kind: "accept" };
    out.results.push({
      id: resultId, record_id: recordId, settings_version: 1, verdict: verdict.kind, quality: JSON.stringify({ channels, verdict }),
      channels_used: used, spectral: JSON.stringify({ nperseg: NPERSEG, noverlap: NPERSEG / 2, lineSpacingHz: SAMPLE_RATE_HZ / NPERSEG, averages: AVERAGES }),
      singular_values: JSON.stringify(displaySpectrum(identified, fMax, rng)), warnings: JSON.stringify([DEMO_HISTORY_WARNING]),
      timings_ms: JSON.stringify({}), engine_version: "modewarden-demo-history-1", extras: null, analysed_at: doneAt,
    });
    const assignedByTracked = new Map<string, { modeId: string; mac: number; dev: number; cost: number }>();
    identified.forEach((m, i) => {
      const modeId = stableId(`mode:${resultId}:${i}`);
      out.modes.push({ id: modeId, result_id: resultId, mode_index: i, ...m.row });
      assignedByTracked.set(m.trackedId, { modeId, mac: m.mac, dev: m.dev, cost: Math.abs(m.dev) + (1 - m.mac) });
    });
    for (const m of model.modes) {
      const trackedId = tracked.get(m.label) as string;
      const a = assignedByTracked.get(trackedId);
      out.assignments.push({
        id: stableId(`assignment:${resultId}:${trackedId}`), result_id: resultId, tracked_mode_id: trackedId, identified_mode_id: a?.modeId ?? null,
        mac: a ? Number(a.mac.toFixed(5)) : null, frequency_deviation: a ? Number(a.dev.toFixed(6)) : null, cost: a ? Number(a.cost.toFixed(6)) : null,
      });
    }
  }
  return out;
}

async function insertChunks(trx: Knex.Transaction, table: string, rows: object[], conflict: string[]): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) {
    await trx(table).insert(rows.slice(i, i + CHUNK)).onConflict(conflict).ignore();
  }
}

/** Tracked modes of the demo asset (left alone when present: a user may have tuned them); ids by label. */
async function ensureTrackedModes(trx: Knex.Transaction, model: DemoAssetModel): Promise<Map<string, string>> {
  await trx("tracked_modes").insert(model.modes.map((m) => ({
    id: stableId(`tracked:${model.assetId}:${m.label}`), asset_id: model.assetId, label: m.label, nominal_frequency_hz: m.f20,
    band_low_hz: Number((m.f20 * (1 - m.bandFraction)).toFixed(4)), band_high_hz: Number((m.f20 * (1 + m.bandFraction)).toFixed(4)),
    reference_shape: JSON.stringify(m.shape), active: true,
  }))).onConflict(["asset_id", "label"]).ignore();
  const rows: { id: string; label: string }[] = await trx("tracked_modes").select("id", "label").where({ asset_id: model.assetId });
  return new Map(rows.map((r) => [r.label, r.id]));
}

/** Seed the demo history of every Larkspur asset; returns the number of records added. */
export async function seedDemoHistory(knex: Knex, opts: DemoHistoryOptions = {}): Promise<number> {
  const now = opts.now ?? new Date();
  const days = opts.days ?? 365;
  const models = demoModels(DEMO_ASSETS);
  let added = 0;
  for (const [k, asset] of DEMO_ASSETS.entries()) {
    const model = models[k];
    await knex.transaction(async (trx) => {
      await trx("analysis_settings").insert({ asset_id: asset.id, version: 1, settings: JSON.stringify(DEFAULT_ANALYSIS_SETTINGS) })
        .onConflict(["asset_id", "version"]).ignore();
      const tracked = await ensureTrackedModes(trx, model);
      const present = new Set((await trx("records").select("gateway_record_id")
        .where({ gateway_id: asset.gateway.id }).andWhere("gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`))
        .map((r: { gateway_record_id: string }) => r.gateway_record_id));
      const slots = demoSlots(now, days, 7 * k + 3).filter((at) => !present.has(`${DEMO_HISTORY_PREFIX}${new Date(at).toISOString()}`));
      if (slots.length === 0) return;
      const rows = historyRows(asset, model, tracked, slots, now.getTime());
      await insertChunks(trx, "records", rows.records, ["gateway_id", "gateway_record_id"]);
      await insertChunks(trx, "analysis_results", rows.results, ["record_id", "settings_version"]);
      await insertChunks(trx, "identified_modes", rows.modes, ["id"]);
      await insertChunks(trx, "mode_assignments", rows.assignments, ["id"]);
      await insertChunks(trx, "record_response_levels", rows.levels, ["record_id"]);
      added += slots.length;
    });
  }
  return added;
}
