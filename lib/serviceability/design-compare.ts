/**
 * Design (or FE) modes against measured tracked modes (pure, no I/O).
 *
 * Matching: an explicit link set by the engineer wins; every other design mode is paired
 * with the unlinked tracked mode whose nominal frequency is nearest, if within ±25 % of the
 * design frequency [practice: FE models of footbridges and towers are commonly 10–20 % off
 * before updating], taking pairs in order of increasing relative difference so that each
 * tracked mode is used once. Tracked nominal frequencies (not each record's identification)
 * are matched so that the pairing stays stable between records.
 * Ratio = measured / design, with the measured value the median of the period's
 * identifications (the latest is shown too). MAC [pub: Allemang & Brown, IMAC 1982] is taken
 * over the channels both shapes give, when both exist and at least two channels overlap.
 */
import { macReal } from "@/lib/modal/mac";

export const DEFAULT_MATCH_BAND_FRACTION = 0.25;

export interface DesignSide { id: string; label: string; frequencyHz: number; trackedModeId: string | null; shape: Record<string, number> | null }
export interface TrackedSide {
  id: string; label: string; nominalFrequencyHz: number;
  /** Identified frequencies in the period, oldest first. */
  frequenciesHz: number[];
  /** Median measured shape of the period (or the reference shape), by channel code. */
  shape: Record<string, number> | null;
}

export type ComparisonFlag = "no_measured_mode" | "no_design_mode" | "not_identified_in_period";

export interface ComparisonRow {
  design: { id: string; label: string; frequencyHz: number } | null;
  tracked: { id: string; label: string; nominalFrequencyHz: number } | null;
  matchedBy: "link" | "frequency" | null;
  measuredMedianHz: number | null;
  measuredLatestHz: number | null;
  identifications: number;
  /** measured median / design; null when either is missing. */
  ratio: number | null;
  mac: number | null;
  flag: ComparisonFlag | null;
}

export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** MAC over the channels both shapes give (null with fewer than two, or a zero part). */
export function shapeMac(a: Record<string, number> | null, b: Record<string, number> | null): number | null {
  if (!a || !b) return null;
  const codes = Object.keys(a).filter((c) => c in b && Number.isFinite(a[c]) && Number.isFinite(b[c]));
  if (codes.length < 2) return null;
  const va = codes.map((c) => a[c]);
  const vb = codes.map((c) => b[c]);
  if (va.every((v) => v === 0) || vb.every((v) => v === 0)) return null;
  return macReal(va, vb);
}

/** Pairs design with tracked modes (see the file header) and builds one row per design mode and per unmatched tracked mode. */
export function compareDesignModes(design: readonly DesignSide[], tracked: readonly TrackedSide[], bandFraction = DEFAULT_MATCH_BAND_FRACTION): ComparisonRow[] {
  const trackedById = new Map(tracked.map((t) => [t.id, t]));
  const pair = new Map<string, { t: TrackedSide; by: "link" | "frequency" }>();
  const used = new Set<string>();
  for (const d of design) {
    const t = d.trackedModeId ? trackedById.get(d.trackedModeId) : undefined;
    if (t && !used.has(t.id)) { pair.set(d.id, { t, by: "link" }); used.add(t.id); }
  }
  const candidates: { d: DesignSide; t: TrackedSide; rel: number }[] = [];
  for (const d of design) {
    if (pair.has(d.id)) continue;
    for (const t of tracked) {
      if (used.has(t.id)) continue;
      const rel = Math.abs(t.nominalFrequencyHz - d.frequencyHz) / d.frequencyHz;
      if (rel <= bandFraction) candidates.push({ d, t, rel });
    }
  }
  candidates.sort((a, b) => a.rel - b.rel);
  for (const c of candidates) {
    if (pair.has(c.d.id) || used.has(c.t.id)) continue;
    pair.set(c.d.id, { t: c.t, by: "frequency" });
    used.add(c.t.id);
  }
  const rows: ComparisonRow[] = design.map((d) => {
    const p = pair.get(d.id);
    const row = measuredRow(p?.t ?? null);
    return {
      ...row, design: { id: d.id, label: d.label, frequencyHz: d.frequencyHz }, matchedBy: p?.by ?? null,
      ratio: row.measuredMedianHz === null ? null : row.measuredMedianHz / d.frequencyHz,
      mac: p ? shapeMac(d.shape, p.t.shape) : null,
      flag: !p ? "no_measured_mode" : row.measuredMedianHz === null ? "not_identified_in_period" : null,
    };
  });
  for (const t of tracked) {
    if (used.has(t.id)) continue;
    rows.push({ ...measuredRow(t), design: null, matchedBy: null, ratio: null, mac: null, flag: "no_design_mode" });
  }
  const key = (r: ComparisonRow) => r.design?.frequencyHz ?? r.tracked?.nominalFrequencyHz ?? 0;
  return rows.sort((a, b) => key(a) - key(b));
}

function measuredRow(t: TrackedSide | null) {
  return {
    tracked: t ? { id: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz } : null,
    measuredMedianHz: t ? median(t.frequenciesHz) : null,
    measuredLatestHz: t && t.frequenciesHz.length ? t.frequenciesHz[t.frequenciesHz.length - 1] : null,
    identifications: t?.frequenciesHz.length ?? 0,
  };
}
