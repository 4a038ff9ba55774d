/**
 * One record → modal parameters: quality screening, Welch CSD, FDD, peak picking, EFDD and
 * half-power damping, optionally SSI-COV as a second estimator (REFERENCES.md §Modal
 * identification). Pure: runs unchanged in a worker, a test or the browser.
 */
import { decimate } from "@/lib/signal/decimate";
import { screenRecord, type QualityOptions, type QualityReport } from "@/lib/signal/quality";
import { chooseSegmentLength } from "@/lib/signal/segment-length";
import { estimateCsdMatrix } from "@/lib/signal/welch-csd";
import { decomposeCsdMatrix, singularVector } from "./fdd";
import { estimateEfdd } from "./efdd";
import { halfPowerDamping } from "./half-power";
import { mac, mpc } from "./mac";
import { pickFddPeaks, type FddPeak, type PeakPickingOptions } from "./peak-picking";
import { realiseShape } from "./shape";
import { identifyModesSsiCov, type SsiCovOptions, type SsiMode, type StabilisationPoint } from "./ssi-cov";
import { validateIdentifyInput, type IdentifyOptions, type ModalRecord } from "./identify-options";

export type { IdentifyOptions, ModalRecord } from "./identify-options";

/** One identified mode. */
export interface IdentifiedMode {
  /** Natural frequency in Hz: EFDD (zero crossings) when available, else the refined FDD peak; SSI for SSI-only modes. */
  frequencyHz: number;
  /** Damping ratio (fraction) from `dampingMethod`, or null when no estimator succeeded. */
  dampingRatio: number | null;
  dampingMethod: "efdd" | "half-power" | "ssi-cov" | null;
  /** False when the half-power bandwidth spans < minBandwidthLines lines or the record < minCycles periods. */
  dampingReliable: boolean;
  reliability: { bandwidthLines: number | null; cyclesInRecord: number };
  fdd: { peakFrequencyHz: number; line: number; singularValue: 1 | 2; prominenceDb: number; coherence: number } | null;
  efdd: { frequencyHz: number; dampingRatio: number; logDecrement: number; bellLines: number } | null;
  halfPower: { dampingRatio: number; q: number; lossFactor: number; bandwidthLines: number } | null;
  ssi: { frequencyHz: number; dampingRatio: number; mac: number } | null;
  /** Modal phase collinearity of the complex shape, [0, 1]. */
  mpc: number;
  /** Real shape per channel (record order), max |value| = 1, largest +1. */
  shape: Float64Array;
  /** Complex shape (unit norm) as identified. */
  shapeComplex: { re: Float64Array; im: Float64Array };
  possiblyCoupled: boolean;
  band: number | null;
}

export interface IdentifyResult {
  /** Channels actually used (after quality exclusions), in record order. */
  channels: string[];
  modes: IdentifiedMode[];
  singularValues: { frequencyHz: Float64Array; s1: Float64Array; s2: Float64Array | null; s3: Float64Array | null };
  spectral: { nperseg: number; noverlap: number; lineSpacingHz: number; averages: number };
  quality: QualityReport;
  warnings: string[];
  timingsMs: Record<string, number>;
  /**
   * SSI-COV's stabilisation diagram, present when SSI-COV ran: the physical poles only
   * (0 < ζ ≤ 0.2, below Nyquist), frequency rounded to 6 and damping to 4 significant digits.
   */
  stabilisation?: StabilisationPoint[];
}

/** Largest damping ratio of a pole drawn on the diagram (SSI-COV's maxDampingRatio default) [practice]. */
const STABILISATION_MAX_DAMPING = 0.2;

/**
 * Identifies the modes of one ambient record.
 *
 * @param record - `sampleRateHz` (> 0), `channels` (codes) and `data` (one array per channel,
 *   equal lengths ≥ 256, m/s²; non-finite samples are reported by the screening and their
 *   channels left out).
 * @param options - see {@link IdentifyOptions}.
 * @returns modes ascending in frequency, s₁…s₃, spectral settings, the quality report,
 *   warnings and stage timings (ms). A rejected record gives no modes and says why.
 * @throws TypeError / RangeError for a malformed record or option.
 */
export function identifyModes(record: ModalRecord, options: IdentifyOptions = {}): IdentifyResult {
  const t0 = performance.now();
  const o = validateIdentifyInput(record, options);
  const timings: Record<string, number> = {};
  const warnings: string[] = [];
  const quality = screenRecord(record.data, record.channels, record.sampleRateHz, o.quality);
  let t = performance.now();
  timings.quality = t - t0;
  const keep = record.channels.map((_, i) => i).filter((i) => quality.verdict.kind === "accept" || (quality.verdict.kind === "accept_without" && !quality.verdict.channels.includes(record.channels[i])));
  const empty = (reason: string): IdentifyResult => ({
    channels: [],
    modes: [],
    singularValues: { frequencyHz: new Float64Array(0), s1: new Float64Array(0), s2: null, s3: null },
    spectral: { nperseg: 0, noverlap: 0, lineSpacingHz: 0, averages: 0 },
    quality,
    warnings: [...warnings, reason],
    timingsMs: { ...timings, total: performance.now() - t0 },
  });
  if (quality.verdict.kind === "reject") return empty(`record rejected: ${quality.verdict.reason}`);
  if (quality.verdict.kind === "accept_without") warnings.push(`channels left out by the quality screening: ${quality.verdict.channels.join(", ")}`);
  const data = keep.map((i) => record.data[i]);
  const channels = keep.map((i) => record.channels[i]);
  const fs = record.sampleRateHz;
  const length = data[0].length;

  let nperseg = o.nperseg;
  if (nperseg === undefined && o.lowestFrequencyHz !== undefined) {
    const choice = chooseSegmentLength(fs, length, { lowestFrequencyHz: o.lowestFrequencyHz, assumedDampingRatio: o.assumedDampingRatio });
    nperseg = choice.nperseg;
    warnings.push(...choice.warnings);
  }
  if (nperseg === undefined) nperseg = Math.min(2048, floorPow2(length / 8));
  const noverlap = Math.round(nperseg * o.overlap);
  const modes: IdentifiedMode[] = [];
  let fddOut: IdentifyResult["singularValues"] = { frequencyHz: new Float64Array(0), s1: new Float64Array(0), s2: null, s3: null };
  let spectral: IdentifyResult["spectral"] = { nperseg, noverlap, lineSpacingHz: fs / nperseg, averages: 0 };

  if (o.methods.includes("fdd")) {
    const csd = estimateCsdMatrix(data, fs, { nperseg, noverlap });
    spectral = { nperseg, noverlap, lineSpacingHz: csd.lineSpacingHz, averages: csd.averages };
    if (csd.averages < 20) warnings.push(`only ${csd.averages} spectral averages (< 20 [practice]): spectra are noisy`);
    timings.csd = performance.now() - t;
    t = performance.now();
    const fdd = decomposeCsdMatrix(csd);
    timings.svd = performance.now() - t;
    t = performance.now();
    const picked = pickFddPeaks(fdd, o.peakPicking);
    warnings.push(...picked.warnings);
    timings.peaks = performance.now() - t;
    t = performance.now();
    for (const p of picked.peaks) modes.push(fddMode(fdd, p, length / fs, o));
    timings.damping = performance.now() - t;
    fddOut = { frequencyHz: fdd.frequencyHz, s1: fdd.singularValues[0], s2: fdd.singularValues[1] ?? null, s3: fdd.singularValues[2] ?? null };
  }

  let stabilisation: StabilisationPoint[] | undefined;
  if (o.methods.includes("ssi")) {
    t = performance.now();
    if (data.length < 2) warnings.push("SSI-COV needs at least 2 channels: skipped");
    else {
      const q = o.ssiSampleRateHz ? Math.max(1, Math.floor(fs / o.ssiSampleRateHz)) : 1;
      const ssiData = q > 1 ? data.map((x) => decimate(x, q)) : data;
      const ssiOptions: SsiCovOptions = { ...o.ssi, bandsHz: o.ssi.bandsHz ?? o.peakPicking.bandsHz };
      const ssi = identifyModesSsiCov({ sampleRateHz: fs / q, channels, data: ssiData }, ssiOptions);
      warnings.push(...ssi.warnings.map((w) => `SSI-COV: ${w}`));
      warnings.push(...mergeSsi(modes, ssi.modes, length / fs, o.methods.includes("fdd")));
      stabilisation = compactStabilisation(ssi.stabilisation, fs / q / 2);
    }
    timings.ssi = performance.now() - t;
  }
  modes.sort((a, b) => a.frequencyHz - b.frequencyHz);
  timings.total = performance.now() - t0;
  const out: IdentifyResult = { channels, modes, singularValues: fddOut, spectral, quality, warnings, timingsMs: timings };
  if (stabilisation) out.stabilisation = stabilisation;
  return out;
}

/** The diagram's physical poles (0 < ζ ≤ 0.2, 0 < f < Nyquist), rounded for storage and display. */
function compactStabilisation(points: readonly StabilisationPoint[], nyquistHz: number): StabilisationPoint[] {
  return points
    .filter((p) => Number.isFinite(p.frequencyHz) && Number.isFinite(p.dampingRatio)
      && p.frequencyHz > 0 && p.frequencyHz < nyquistHz && p.dampingRatio > 0 && p.dampingRatio <= STABILISATION_MAX_DAMPING)
    .map((p) => ({ order: p.order, frequencyHz: Number(p.frequencyHz.toPrecision(6)), dampingRatio: Number(p.dampingRatio.toPrecision(4)), stable: p.stable }));
}

function fddMode(fdd: ReturnType<typeof decomposeCsdMatrix>, p: FddPeak, durationS: number, o: ReturnType<typeof validateIdentifyInput>): IdentifiedMode {
  const v = singularVector(fdd, p.line, p.rank);
  const efdd = estimateEfdd(fdd, p.line, v);
  const hp = halfPowerDamping(fdd.singularValues[p.rank], fdd.lineSpacingHz, p.line);
  // EFDD's zero-crossing frequency uses the whole bell and scatters less than the peak line;
  // it is trusted when it falls inside its own bell.
  const inBell = efdd !== null && efdd.frequencyHz >= efdd.bellRange[0] * fdd.lineSpacingHz && efdd.frequencyHz <= efdd.bellRange[1] * fdd.lineSpacingHz;
  const frequencyHz = efdd && inBell ? efdd.frequencyHz : p.frequencyHz;
  const dampingRatio = efdd ? efdd.dampingRatio : hp ? hp.dampingRatio : null;
  const dampingMethod = efdd ? "efdd" : hp ? "half-power" : null;
  const bandwidthLines = dampingRatio === null ? null : (2 * dampingRatio * frequencyHz) / fdd.lineSpacingHz;
  const cycles = frequencyHz * durationS;
  return {
    frequencyHz,
    dampingRatio,
    dampingMethod,
    dampingReliable: bandwidthLines !== null && bandwidthLines >= o.minBandwidthLines && cycles >= o.minCycles,
    reliability: { bandwidthLines, cyclesInRecord: cycles },
    fdd: { peakFrequencyHz: p.frequencyHz, line: p.line, singularValue: p.rank === 0 ? 1 : 2, prominenceDb: p.prominenceDb, coherence: p.coherence },
    efdd: efdd ? { frequencyHz: efdd.frequencyHz, dampingRatio: efdd.dampingRatio, logDecrement: efdd.logDecrement, bellLines: efdd.bellLines } : null,
    halfPower: hp ? { dampingRatio: hp.dampingRatio, q: hp.q, lossFactor: hp.lossFactor, bandwidthLines: hp.bandwidthLines } : null,
    ssi: null,
    mpc: mpc(v),
    shape: realiseShape(v),
    shapeComplex: v,
    possiblyCoupled: p.possiblyCoupled,
    band: p.band,
  };
}

/**
 * Attaches each SSI mode to the FDD mode it matches (frequency within 5 %, MAC ≥ 0.8
 * [practice]). An unmatched SSI mode is added when SSI ran alone, or when it lies within 5 %
 * of an FDD mode flagged possibly coupled (SSI separating what FDD could not); otherwise it is
 * only named in a warning, since an unconfirmed pole family is as likely spurious.
 */
function mergeSsi(modes: IdentifiedMode[], ssiModes: SsiMode[], durationS: number, haveFdd: boolean): string[] {
  const warnings: string[] = [];
  const fddModes = modes.slice();
  const used = new Set<number>();
  for (const m of modes) {
    let best = -1;
    let bestMac = 0;
    ssiModes.forEach((s, i) => {
      if (used.has(i) || Math.abs(s.frequencyHz - m.frequencyHz) > 0.05 * m.frequencyHz) return;
      const mm = mac(m.shapeComplex, s.shape);
      if (mm >= 0.8 && (best < 0 || Math.abs(s.frequencyHz - m.frequencyHz) < Math.abs(ssiModes[best].frequencyHz - m.frequencyHz))) {
        best = i;
        bestMac = mm;
      }
    });
    if (best >= 0) {
      used.add(best);
      m.ssi = { frequencyHz: ssiModes[best].frequencyHz, dampingRatio: ssiModes[best].dampingRatio, mac: bestMac };
    }
  }
  ssiModes.forEach((s, i) => {
    if (used.has(i)) return;
    if (haveFdd && !fddModes.some((m) => m.possiblyCoupled && Math.abs(m.frequencyHz - s.frequencyHz) <= 0.05 * m.frequencyHz)) {
      warnings.push(`SSI-COV mode at ${s.frequencyHz.toFixed(3)} Hz (ζ = ${(100 * s.dampingRatio).toFixed(2)} %) has no FDD counterpart: not reported`);
      return;
    }
    let norm = 0;
    for (let c = 0; c < s.shape.re.length; c++) norm += s.shape.re[c] ** 2 + s.shape.im[c] ** 2;
    const k = 1 / Math.sqrt(norm);
    modes.push({
      frequencyHz: s.frequencyHz,
      dampingRatio: s.dampingRatio,
      dampingMethod: "ssi-cov",
      // SSI damping is not biased by spectral resolution; only the record length limits it.
      dampingReliable: s.frequencyHz * durationS >= 1000,
      reliability: { bandwidthLines: null, cyclesInRecord: s.frequencyHz * durationS },
      fdd: null,
      efdd: null,
      halfPower: null,
      ssi: { frequencyHz: s.frequencyHz, dampingRatio: s.dampingRatio, mac: 1 },
      mpc: s.mpc,
      shape: realiseShape(s.shape),
      shapeComplex: { re: s.shape.re.map((x) => x * k), im: s.shape.im.map((x) => x * k) },
      possiblyCoupled: haveFdd,
      band: null,
    });
  });
  return warnings;
}

function floorPow2(n: number): number {
  let p = 8;
  while (p * 2 <= n) p *= 2;
  return p;
}

export type { QualityOptions, PeakPickingOptions };
