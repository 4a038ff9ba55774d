/**
 * Assembles an asset's serviceability view from its modes, observations and record levels
 * (pure, no I/O): footbridge frequency and acceleration checks, damping against guidance,
 * and for towers, masts and chimneys the vortex-shedding critical speeds and lock-in
 * candidates. Times cross as epoch milliseconds so the view is plain JSON.
 */
import { aggregateResponseLevels, type ChannelResponseLevel } from "@/lib/signal/response-levels";
import { compareDamping, dampingRatioFromLogDecrement, FOOTBRIDGE_DAMPING_MATERIALS, guessFootbridgeMaterial, guessTowerDampingType, logDecrementFromDampingRatio, TOWER_DAMPING_TYPES, type DampingVerdict } from "./damping-guidance";
import { median } from "./design-compare";
import { directionFromLabel, directionFromShape } from "./direction";
import { checkFootbridgeAcceleration } from "./footbridge-acceleration";
import { checkFootbridgeFrequency, type FootbridgeFrequencyCheck, type ModeDirection } from "./footbridge-frequency";
import type { ServiceabilityValues } from "./values";
import { classifyLockIn, criticalWindSpeed, type LockInClass } from "./vortex-shedding";

export type StructureFamily = "footbridge" | "tower" | "other";

export function familyOf(kind: string): StructureFamily {
  if (kind === "footbridge" || kind === "pedestrian_bridge") return "footbridge";
  if (kind === "tower" || kind === "mast" || kind === "chimney") return "tower";
  return "other";
}

export interface AssessModeInput {
  id: string; label: string; nominalFrequencyHz: number; referenceShape: Record<string, number> | null;
  /** Direction from a linked or matched design mode, if the engineer set one. */
  designDirection: ModeDirection | null;
}
export interface AssessObservation { trackedModeId: string; frequencyHz: number; dampingRatio: number | null; dampingReliable: boolean }
export interface AssessRecord { recordId: string; atMs: number; windSpeedMps: number | null; levels: ChannelResponseLevel[] | null; channelsUsed: string[] }

export interface AssessInput {
  kind: string;
  material: string | null;
  values: ServiceabilityValues;
  /** Channel code → direction ("x", "-z", …). */
  channelDirections: Record<string, string>;
  modes: AssessModeInput[];
  observations: AssessObservation[];
  records: AssessRecord[];
  sectionWidthM: number | null;
  dampingGuidanceKey: string | null;
}

export interface DampingGuidanceView { key: string; label: string; source: string; lowRatio: number; highRatio: number; logDecrement: number | null; guessed: boolean }

export interface ModeView {
  trackedModeId: string; label: string; nominalFrequencyHz: number;
  direction: ModeDirection | null; directionFrom: "design" | "label" | "shape" | null;
  /** Horizontal axis of a tower mode (x / y), from the label "(x)" or the shape. */
  axis: "x" | "y" | null;
  measuredMedianHz: number | null; identifications: number;
  frequencyCheck: FootbridgeFrequencyCheck | null;
  damping: { medianRatio: number | null; count: number; reliableOnly: boolean; logDecrement: number | null; verdict: DampingVerdict | null };
}

export interface Distribution { count: number; median: number | null; p95: number | null; max: number | null; exceedCount: number }
export interface AxisAccelerationView { axis: "vertical" | "horizontal"; limitMps2: number; crowdLimitMps2: number | null; peak: Distribution; rms1s: Distribution }

export interface VortexModeView { trackedModeId: string; label: string; axis: "x" | "y" | null; frequencyHz: number; vCritMps: number | null; bandMps: [number, number] | null; recordsInBand: number }
export interface LockInEpisode { recordId: string; atMs: number; windSpeedMps: number; crestFactor: number | null; modeLabel: string; vCritMps: number; classification: LockInClass }

export interface ServiceabilityAssessment {
  family: StructureFamily;
  values: ServiceabilityValues;
  dampingGuidance: DampingGuidanceView | null;
  modes: ModeView[];
  acceleration: { recordsTotal: number; recordsWithLevels: number; axes: AxisAccelerationView[] } | null;
  vortex: { sectionWidthM: number | null; strouhal: number; recordsWithWind: number; maxWindMps: number | null; modes: VortexModeView[]; episodes: LockInEpisode[] } | null;
}

function guidanceOf(family: StructureFamily, key: string | null, kind: string, material: string | null): DampingGuidanceView | null {
  if (family === "footbridge") {
    const k = key && FOOTBRIDGE_DAMPING_MATERIALS.some((m) => m.key === key) ? key : guessFootbridgeMaterial(material);
    const m = FOOTBRIDGE_DAMPING_MATERIALS.find((x) => x.key === k) ?? FOOTBRIDGE_DAMPING_MATERIALS[0];
    return { key: m.key, label: m.label, source: m.source, lowRatio: m.minimumRatio, highRatio: m.meanRatio, logDecrement: null, guessed: k !== key };
  }
  if (family === "tower") {
    const k = key && TOWER_DAMPING_TYPES.some((t) => t.key === key) ? key : guessTowerDampingType(kind, material);
    const t = TOWER_DAMPING_TYPES.find((x) => x.key === k) ?? TOWER_DAMPING_TYPES[0];
    const zeta = dampingRatioFromLogDecrement(t.logDecrement);
    return { key: t.key, label: t.label, source: t.source, lowRatio: zeta, highRatio: zeta, logDecrement: t.logDecrement, guessed: k !== key };
  }
  return null;
}

/** Nearest-rank percentile of sorted values. */
function percentile(sorted: number[], p: number): number | null {
  if (sorted.length === 0) return null;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(p * sorted.length) - 1))];
}

function distribution(values: number[], limit: number): Distribution {
  const s = [...values].sort((a, b) => a - b);
  return { count: s.length, median: median(s), p95: percentile(s, 0.95), max: s.length ? s[s.length - 1] : null, exceedCount: s.filter((v) => v > limit).length };
}

function towerAxis(m: AssessModeInput, dirs: Record<string, string>): "x" | "y" | null {
  const l = /\((x|y)\)/i.exec(m.label);
  if (l) return l[1].toLowerCase() as "x" | "y";
  if (!m.referenceShape) return null;
  let ex = 0, ey = 0;
  for (const [c, v] of Object.entries(m.referenceShape)) {
    const a = (dirs[c] ?? "").replace("-", "");
    if (a === "x") ex += v * v;
    else if (a === "y") ey += v * v;
  }
  return ex === 0 && ey === 0 ? null : ex >= ey ? "x" : "y";
}

/** Horizontal crest factor (peak / RMS) of the record's dominant horizontal axis, or null. */
function horizontalCrest(r: AssessRecord): number | null {
  if (!r.levels) return null;
  const h = aggregateResponseLevels(r.levels, new Set(r.channelsUsed)).filter((l) => l.axis !== "z" && l.rmsMps2 > 0);
  if (h.length === 0) return null;
  const dom = h.reduce((a, b) => (b.rmsMps2 > a.rmsMps2 ? b : a));
  return dom.peakMps2 / dom.rmsMps2;
}

export function assessServiceability(input: AssessInput): ServiceabilityAssessment {
  const family = familyOf(input.kind);
  const { values } = input;
  const guidance = guidanceOf(family, input.dampingGuidanceKey, input.kind, input.material);
  const modes: ModeView[] = input.modes.map((m) => {
    const obs = input.observations.filter((o) => o.trackedModeId === m.id);
    const fromLabel = directionFromLabel(m.label);
    const fromShape = directionFromShape(m.referenceShape, input.channelDirections);
    const [direction, directionFrom] = m.designDirection ? [m.designDirection, "design" as const]
      : fromLabel ? [fromLabel, "label" as const] : fromShape ? [fromShape, "shape" as const] : [null, null];
    const measuredMedianHz = median(obs.map((o) => o.frequencyHz));
    const reliable = obs.filter((o) => o.dampingRatio !== null && o.dampingReliable).map((o) => o.dampingRatio as number);
    const any = obs.filter((o) => o.dampingRatio !== null).map((o) => o.dampingRatio as number);
    const dampingValues = reliable.length ? reliable : any;
    const medianRatio = median(dampingValues);
    const f = measuredMedianHz ?? m.nominalFrequencyHz;
    return {
      trackedModeId: m.id, label: m.label, nominalFrequencyHz: m.nominalFrequencyHz, direction, directionFrom,
      axis: family === "tower" ? towerAxis(m, input.channelDirections) : null,
      measuredMedianHz, identifications: obs.length,
      frequencyCheck: family === "footbridge" && direction ? checkFootbridgeFrequency(f, direction, values.frequency) : null,
      damping: {
        medianRatio, count: dampingValues.length, reliableOnly: reliable.length > 0,
        logDecrement: medianRatio !== null && medianRatio < 1 ? logDecrementFromDampingRatio(medianRatio) : null,
        verdict: medianRatio !== null && guidance ? compareDamping(medianRatio, guidance.lowRatio, guidance.highRatio) : null,
      },
    };
  });

  let acceleration: ServiceabilityAssessment["acceleration"] = null;
  if (family === "footbridge") {
    const withLevels = input.records.filter((r) => r.levels && r.levels.length);
    const peaks = { vertical: [] as number[], horizontal: [] as number[] };
    const rms = { vertical: [] as number[], horizontal: [] as number[] };
    for (const r of withLevels) {
      const axes = aggregateResponseLevels(r.levels ?? [], new Set(r.channelsUsed));
      const v = axes.find((a) => a.axis === "z");
      const h = axes.filter((a) => a.axis !== "z");
      if (v) { peaks.vertical.push(v.peakMps2); rms.vertical.push(v.maxRms1sMps2); }
      if (h.length) { peaks.horizontal.push(Math.max(...h.map((a) => a.peakMps2))); rms.horizontal.push(Math.max(...h.map((a) => a.maxRms1sMps2))); }
    }
    const a = values.acceleration;
    acceleration = {
      recordsTotal: input.records.length, recordsWithLevels: withLevels.length,
      axes: (["vertical", "horizontal"] as const).map((axis) => {
        const limit = checkFootbridgeAcceleration(0, axis, a).limitMps2;
        return { axis, limitMps2: limit, crowdLimitMps2: axis === "horizontal" ? a.maxHorizontalCrowdMps2 : null, peak: distribution(peaks[axis], limit), rms1s: distribution(rms[axis], limit) };
      }),
    };
  }

  let vortex: ServiceabilityAssessment["vortex"] = null;
  if (family === "tower") {
    const v = values.vortex;
    // First bending mode per horizontal axis: the lowest-frequency tracked mode of that axis.
    const firsts = new Map<string, ModeView>();
    for (const m of [...modes].sort((a, b) => a.nominalFrequencyHz - b.nominalFrequencyHz)) {
      const k = m.axis ?? "?";
      if (!firsts.has(k)) firsts.set(k, m);
    }
    const windy = input.records.filter((r) => r.windSpeedMps !== null);
    const episodes: LockInEpisode[] = [];
    const vmodes: VortexModeView[] = [...firsts.values()].map((m) => {
      const f = m.measuredMedianHz ?? m.nominalFrequencyHz;
      const vCrit = input.sectionWidthM !== null ? criticalWindSpeed(input.sectionWidthM, f, v.strouhal) : null;
      let inBand = 0;
      if (vCrit !== null) {
        for (const r of windy) {
          const crest = horizontalCrest(r);
          const c = classifyLockIn(r.windSpeedMps as number, vCrit, crest, v);
          if (c === "outside_band") continue;
          inBand++;
          episodes.push({ recordId: r.recordId, atMs: r.atMs, windSpeedMps: r.windSpeedMps as number, crestFactor: crest, modeLabel: m.label, vCritMps: vCrit, classification: c });
        }
      }
      return {
        trackedModeId: m.trackedModeId, label: m.label, axis: m.axis, frequencyHz: f, vCritMps: vCrit,
        bandMps: vCrit !== null ? [vCrit * (1 - v.lockInBandFraction), vCrit * (1 + v.lockInBandFraction)] : null, recordsInBand: inBand,
      };
    });
    const order = { lock_in_candidate: 0, in_band_unknown_response: 1, in_band_broadband: 2, outside_band: 3 } as const;
    episodes.sort((a, b) => order[a.classification] - order[b.classification] || b.atMs - a.atMs);
    vortex = {
      sectionWidthM: input.sectionWidthM, strouhal: v.strouhal, recordsWithWind: windy.length,
      maxWindMps: windy.length ? Math.max(...windy.map((r) => r.windSpeedMps as number)) : null, modes: vmodes, episodes: episodes.slice(0, 50),
    };
  }
  return { family, values, dampingGuidance: guidance, modes, acceleration, vortex };
}
