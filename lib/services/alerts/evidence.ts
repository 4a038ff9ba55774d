/**
 * Reading the evidence snapshot stored with an alert (drift service `evidenceSnapshot`: the
 * lib/stats AlertEvidence plus mode labels, nominal frequencies and the baseline version)
 * into a typed view for the alert page and the e-mails. Snapshots that miss fields (older or
 * hand-made alerts) still give a view with what they have.
 */
import { z } from "zod";

const num = z.number().finite();
const ModePoint = z.object({
  modeId: z.string(), residualHz: num, residualLcl: num, residualUcl: num, ewma: num, lcl: num, ucl: num,
});
const Point = z.object({
  timeMs: num,
  qualityPassed: z.boolean().optional(),
  outOfEnvelope: z.boolean().optional(),
  modes: z.array(ModePoint).default([]),
  t2: z.object({ value: num, ucl: num }).nullable().optional(),
});
const Snapshot = z.object({
  rule: z.string().optional(),
  modesBeyond: z.array(z.string()).default([]),
  t2Beyond: z.boolean().optional(),
  point: Point.optional(),
  window: z.array(Point).default([]),
  baselineVersion: z.number().int().optional(),
  modeLabels: z.record(z.string(), z.string()).default({}),
  nominalHz: z.record(z.string(), z.number()).default({}),
});

export interface EvidenceMode {
  modeId: string;
  label: string;
  beyond: boolean;
  residualHz: number;
  residualLcl: number;
  residualUcl: number;
  /** Residual as a percentage of the mode's nominal frequency (baseline at 20 °C), or null. */
  residualPct: number | null;
  ewma: number;
  ewmaLcl: number;
  ewmaUcl: number;
}

export interface EvidenceView {
  rule: string;
  baselineVersion: number | null;
  /** Time of the raising point (end of its day), ms UTC, or null. */
  pointTimeMs: number | null;
  /** First point of the window that led to the alert, ms UTC, or null. */
  windowStartMs: number | null;
  windowPoints: number;
  qualityPassed: boolean | null;
  outOfEnvelope: boolean | null;
  modes: EvidenceMode[];
  t2: { value: number; ucl: number; beyond: boolean } | null;
}

export function readEvidence(snapshot: Record<string, unknown>): EvidenceView {
  const parsed = Snapshot.safeParse(snapshot);
  const s = parsed.success ? parsed.data : Snapshot.parse({});
  const beyond = new Set(s.modesBeyond);
  const p = s.point;
  const modes = (p?.modes ?? []).map((m): EvidenceMode => {
    const nominal = s.nominalHz[m.modeId];
    return {
      modeId: m.modeId, label: s.modeLabels[m.modeId] ?? m.modeId, beyond: beyond.has(m.modeId),
      residualHz: m.residualHz, residualLcl: m.residualLcl, residualUcl: m.residualUcl,
      residualPct: nominal !== undefined && nominal > 0 ? (100 * m.residualHz) / nominal : null,
      ewma: m.ewma, ewmaLcl: m.lcl, ewmaUcl: m.ucl,
    };
  });
  return {
    rule: s.rule ?? "drift beyond its limits",
    baselineVersion: s.baselineVersion ?? null,
    pointTimeMs: p?.timeMs ?? null,
    windowStartMs: s.window.length > 0 ? s.window[0].timeMs : p?.timeMs ?? null,
    windowPoints: s.window.length,
    qualityPassed: p?.qualityPassed ?? null,
    outOfEnvelope: p?.outOfEnvelope ?? null,
    modes,
    t2: p?.t2 ? { ...p.t2, beyond: p.t2.value > p.t2.ucl } : null,
  };
}

const hz = (v: number) => `${v >= 0 ? "+" : "−"}${Math.abs(v).toFixed(4)} Hz`;

/** Plain-text lines summarising the evidence (e-mails): rule, modes beyond with residual and limits, T². */
export function evidenceSummaryLines(e: EvidenceView): string[] {
  const shown = e.modes.some((m) => m.beyond) ? e.modes.filter((m) => m.beyond) : e.modes;
  const lines = [`Rule: ${e.rule}${e.baselineVersion === null ? "" : ` (baseline version ${e.baselineVersion})`}.`];
  for (const m of shown) {
    const pct = m.residualPct === null ? "" : ` (${m.residualPct >= 0 ? "+" : "−"}${Math.abs(m.residualPct).toFixed(2)} %)`;
    lines.push(`${m.label}: daily residual ${hz(m.residualHz)}${pct}, limits ${hz(m.residualLcl)} to ${hz(m.residualUcl)}.`);
  }
  if (e.t2) lines.push(`Hotelling T² ${e.t2.value.toFixed(2)} (limit ${e.t2.ucl.toFixed(2)}).`);
  return lines;
}
