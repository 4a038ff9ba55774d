/**
 * Service results → the plain view shapes of components/records. Inputs are typed
 * structurally (Date or ISO string), so the same mapping serves the page and the JSON route.
 */
import type { RecordStatus } from "@/lib/domain/records";
import type { SensorChannel } from "@/lib/domain/types";
import type { RecordDetail } from "@/lib/services/analysis/records.service";
import type {
  LayoutChannel, ModeView, RecordDetailView, RecordPageView, RecordRowView, TrackedModeView,
} from "@/components/records/types";

const iso = (d: Date | string) => (typeof d === "string" ? d : d.toISOString());

export interface RecordSummaryLike {
  record: {
    id: string; gatewayRecordId: string; startedAt: Date | string; status: RecordStatus; progress: number;
    durationS: number; channels: string[]; temperatureC: number | null; failureReason: string | null;
  };
  latest: { verdict: "accept" | "accept_without" | "reject"; modeCount: number } | null;
}

export function toRecordRowView({ record: r, latest }: RecordSummaryLike): RecordRowView {
  return {
    id: r.id, gatewayRecordId: r.gatewayRecordId, startedAt: iso(r.startedAt), status: r.status, progress: r.progress,
    durationS: r.durationS, channelCount: r.channels.length, temperatureC: r.temperatureC,
    verdict: latest?.verdict ?? null, modeCount: latest ? latest.modeCount : null, failureReason: r.failureReason,
  };
}

export function toRecordPageView(page: { records: RecordSummaryLike[]; nextCursor: string | null }): RecordPageView {
  return { records: page.records.map(toRecordRowView), nextCursor: page.nextCursor };
}

// ---- Record page -------------------------------------------------------------------------


type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj | null => (typeof v === "object" && v !== null && !Array.isArray(v) ? (v as Obj) : null);
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** The engine's per-estimator values (stored as JSON) → typed, each null when absent or malformed. */
function estimatesOf(e: Obj): Pick<ModeView, "fddPeakHz" | "efdd" | "halfPower" | "ssi" | "reliability"> {
  const fdd = obj(e.fdd);
  const efdd = obj(e.efdd);
  const hp = obj(e.halfPower);
  const ssi = obj(e.ssi);
  const rel = obj(e.reliability);
  const pair = <T>(ok: boolean, v: () => T): T | null => (ok ? v() : null);
  return {
    fddPeakHz: fdd ? num(fdd.peakFrequencyHz) : null,
    efdd: pair(efdd !== null && num(efdd.frequencyHz) !== null && num(efdd.dampingRatio) !== null, () => ({ frequencyHz: Number(efdd?.frequencyHz), dampingRatio: Number(efdd?.dampingRatio) })),
    halfPower: pair(hp !== null && num(hp.dampingRatio) !== null, () => ({ dampingRatio: Number(hp?.dampingRatio), q: Number(hp?.q), lossFactor: Number(hp?.lossFactor) })),
    ssi: pair(ssi !== null && num(ssi.frequencyHz) !== null, () => ({ frequencyHz: Number(ssi?.frequencyHz), dampingRatio: Number(ssi?.dampingRatio), mac: Number(ssi?.mac) })),
    reliability: rel ? { bandwidthLines: num(rel.bandwidthLines), cyclesInRecord: Number(rel.cyclesInRecord) } : null,
  };
}

export function toRecordDetailView(d: RecordDetail, channels: SensorChannel[], latest: RecordSummaryLike["latest"] = null): RecordDetailView {
  const a = d.analysis;
  const row = toRecordRowView({ record: d.record, latest: a ? { verdict: a.verdict, modeCount: a.modes.length } : latest });
  const tracked: TrackedModeView[] = (a?.trackedModes ?? []).filter((t) => t.active).map((t) => ({
    id: t.trackedModeId, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, bandLowHz: t.bandLowHz, bandHighHz: t.bandHighHz,
  }));
  const outcomeById = new Map((a?.trackedModes ?? []).map((t) => [t.trackedModeId, t]));
  const layout: LayoutChannel[] = channels.filter((c) => c.active || d.record.channels.includes(c.code))
    .map((c) => ({ code: c.code, positionM: c.positionM, direction: c.direction }));
  const q = a?.qualityVerdict;
  return {
    record: { ...row, sampleRateHz: d.record.sampleRateHz, units: d.record.units, channels: d.record.channels, analysedSettingsVersion: d.record.analysedSettingsVersion },
    trackedModes: tracked,
    layout,
    analysis: a ? {
      settingsVersion: a.settingsVersion,
      verdict: a.verdict,
      verdictNote: q?.kind === "reject" ? q.reason : q?.kind === "accept_without" ? `Left out: ${q.channels.join(", ")}` : null,
      analysedAt: a.analysedAt,
      lineSpacingHz: a.spectral.lineSpacingHz,
      averages: a.spectral.averages,
      warnings: a.warnings,
      spectra: a.singularValues.s1.length ? a.singularValues : null,
      modes: a.modes.map((m) => ({
        modeIndex: m.modeIndex, frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, dampingMethod: m.dampingMethod,
        dampingReliable: m.dampingReliable, mpc: m.mpc, possiblyCoupled: m.possiblyCoupled, shape: m.shape,
        ...estimatesOf(obj(m.estimates) ?? {}),
        tracked: m.trackedModeId ? {
          id: m.trackedModeId, label: m.trackedLabel ?? "Tracked mode", mac: m.macToTracked,
          frequencyDeviation: outcomeById.get(m.trackedModeId)?.frequencyDeviation ?? null,
        } : null,
      })),
      quality: a.channelQuality.map((c) => ({ channel: c.channel, flags: c.flags, rms: c.rms, notes: c.notes })),
      stabilisation: a.stabilisation ? a.stabilisation.map(([order, frequencyHz, dampingRatio, stable]) => ({ order, frequencyHz, dampingRatio, stable })) : null,
      frf: a.frf ? {
        frequencyHz: a.frf.frequencyHz,
        channels: a.frf.channels.map((c) => ({ code: c.channel, magnitude: c.magnitude, phaseDeg: c.phaseRad.map((p) => (p * 180) / Math.PI), coherence: c.coherence })),
      } : null,
    } : null,
  };
}
