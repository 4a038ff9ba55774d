/**
 * Automatic peak picking on the first singular value spectrum of FDD, with close-mode
 * detection on the second [1].
 *
 * A line is a candidate when it is a local maximum of log s₁ with a prominence (the SciPy
 * `find_peaks` definition: height above the higher of the two lowest points reached before a
 * higher value on either side) of at least `minProminenceDb`. It is kept as a mode when
 * - its prominence reaches `strongProminenceDb` and its vector is not random (mean MAC with
 *   the ±1 neighbours ≥ 0.5; the vector of two merged close modes turns across the peak), or
 * - its first singular vector agrees with those of its ±2 neighbours (modal coherence, mean
 *   MAC ≥ `minCoherence`: noise peaks have vectors that change from line to line), differs
 *   (MAC < 0.8) from the higher peak that limits its shallow side (a wiggle on the flank of
 *   a mode carries that mode's shape), and either one mode dominates there (s₁/s₂ ≥
 *   `minDominanceDb`: at resonance G is nearly rank one [1]) or one side falls by ≥
 *   `strongProminenceDb` with s₁/s₂ ≥ `minDominanceDb` − 4 dB (the shoulder of a close
 *   mode) [practice].
 * On simulated records noise wiggles reached 3–4 dB prominence with s₁/s₂ of 4–9 dB at 42
 * averages, while modes stood ≥ 19 dB; a mode 3 % from a stronger one kept only ~3 dB.
 * The peak frequency is refined by a parabola through log s₁ at the three top lines.
 *
 * Close modes: around each s₁ peak, s₂ is examined; a local maximum of s₂ standing at least
 * `closeModeDb` above the median s₂ of the surrounding region means a second mode shares
 * the band, and both are flagged "possibly coupled" [1, §4]. The s₂ peak becomes a mode of
 * its own when its vector is distinct (MAC < 0.8) from every mode already found.
 *
 * [1] Brincker, Zhang & Andersen, Smart Mater. Struct. 10(3):441, 2001.
 */
import { assertFiniteNumber, assertInRange, assertInteger, describe } from "@/lib/numeric/validate";
import { macWithVector, type FddDecomposition } from "./fdd";

export interface PeakPickingOptions {
  /** Search bands [lo, hi] in Hz, 0 ≤ lo < hi; with bands, the strongest valid peak of each band is kept. */
  bandsHz?: [number, number][];
  /** Lowest frequency searched, Hz ≥ 0; default 2 line spacings (avoids the DC leakage). */
  minFrequencyHz?: number;
  /** Highest frequency searched, Hz; default 0.8 × Nyquist (anti-alias roll-off region excluded). */
  maxFrequencyHz?: number;
  /** Minimum prominence of a candidate on 10·log₁₀ s₁ in dB, > 0; default 2 [practice]. */
  minProminenceDb?: number;
  /** Minimum s₁/s₂ at the peak in dB (one mode dominates: G nearly rank one), ≥ 0; default 10 [practice]. */
  minDominanceDb?: number;
  /** Prominence (or one-sided fall) in dB that marks a strong peak, > 0; default 10 [practice]. */
  strongProminenceDb?: number;
  /** Minimum mean MAC of the peak vector with its ±2 neighbours, [0, 1]; default 0.9 [practice]. */
  minCoherence?: number;
  /** Height of an s₂ peak above the local s₂ median (dB) that marks a close mode, > 0; default 6 [practice]. */
  closeModeDb?: number;
  /** Most modes returned (the most prominent), integer ≥ 1; default 20. */
  maxModes?: number;
}

/** A picked peak. */
export interface FddPeak {
  /** Line index of the peak. */
  line: number;
  /** Parabolically refined frequency in Hz. */
  frequencyHz: number;
  /** Which singular value the peak was found on: 0 for s₁, 1 for s₂. */
  rank: number;
  /** Prominence in dB on the spectrum it was found on. */
  prominenceDb: number;
  /** Mean MAC of the vector with its neighbours. */
  coherence: number;
  /** A second mode shares the band (found on s₂). */
  possiblyCoupled: boolean;
  /** Index of the search band it belongs to, or null without bands. */
  band: number | null;
}

interface Resolved {
  bands: [number, number][] | null;
  kMin: number;
  kMax: number;
  minProminenceDb: number;
  minDominanceDb: number;
  strongProminenceDb: number;
  minCoherence: number;
  closeModeDb: number;
  maxModes: number;
}

/**
 * Picks modal peaks on an FDD decomposition.
 *
 * @param fdd - from decomposeCsdMatrix (needs ≥ 2 vectors per line for close modes).
 * @param options - see {@link PeakPickingOptions}.
 * @returns peaks sorted by frequency, and warnings (e.g. an empty search band).
 * @throws TypeError / RangeError for bad options (rule and value in the message).
 */
export function pickFddPeaks(fdd: FddDecomposition, options: PeakPickingOptions = {}): { peaks: FddPeak[]; warnings: string[] } {
  const o = resolve(fdd, options);
  const warnings: string[] = [];
  const s1 = fdd.singularValues[0];
  const s2 = fdd.singularValues[1];
  const db1 = toDb(s1);
  const prom = peakSides(db1, o.kMin, o.kMax);
  const candidates: FddPeak[] = [];
  for (const c of prom) {
    const k = c.line;
    if (c.prominence < o.minProminenceDb) continue;
    let keep: boolean;
    let coh = coherence(fdd, k, 0, 1);
    if (c.prominence >= o.strongProminenceDb) keep = coh >= 0.5;
    else {
      coh = coherence(fdd, k, 0, 2);
      const dominance = s2 ? 10 * Math.log10(s1[k] / Math.max(s2[k], s1[k] * 1e-30)) : Infinity;
      const fall = Math.max(c.leftFall, c.rightFall);
      // A shoulder still needs partial dominance: in a noise floor G ≈ σ²I plus faint modal tails,
      // whose vector is coherent and whose slope falls far, but s₁/s₂ stays within a few dB.
      const shoulder = fall >= o.strongProminenceDb && dominance >= o.minDominanceDb - 4;
      keep = coh >= o.minCoherence && (dominance >= o.minDominanceDb || shoulder) && differsFromNeighbour(fdd, db1, c);
    }
    if (keep) candidates.push({ line: k, frequencyHz: refine(db1, k, fdd.lineSpacingHz), rank: 0, prominenceDb: c.prominence, coherence: coh, possiblyCoupled: false, band: null });
  }
  let peaks: FddPeak[];
  if (o.bands) {
    peaks = [];
    o.bands.forEach(([lo, hi], b) => {
      const inBand = candidates.filter((c) => c.frequencyHz >= lo && c.frequencyHz <= hi);
      if (inBand.length === 0) {
        warnings.push(`no peak with prominence ≥ ${o.minProminenceDb} dB and coherence ≥ ${o.minCoherence} in band ${lo}–${hi} Hz`);
        return;
      }
      const best = inBand.reduce((a, c) => (s1[c.line] > s1[a.line] ? c : a));
      peaks.push({ ...best, band: b });
    });
  } else {
    peaks = candidates.sort((a, b) => b.prominenceDb - a.prominenceDb).slice(0, o.maxModes);
  }
  if (fdd.singularValues.length > 1 && fdd.nVectors > 1) peaks = addCloseModes(fdd, peaks, o);
  peaks.sort((a, b) => a.frequencyHz - b.frequencyHz);
  return { peaks, warnings };
}

function resolve(fdd: FddDecomposition, options: PeakPickingOptions): Resolved {
  if (typeof fdd !== "object" || fdd === null || !Array.isArray(fdd.singularValues)) throw new TypeError(`fdd must be an FddDecomposition (got ${describe(fdd)})`);
  if (typeof options !== "object" || options === null) throw new TypeError(`options must be an object (got ${describe(options)})`);
  const df = fdd.lineSpacingHz;
  const nyq = fdd.frequencyHz[fdd.nLines - 1];
  const minF = options.minFrequencyHz ?? 2 * df;
  const maxF = options.maxFrequencyHz ?? 0.8 * nyq;
  assertInRange(minF, "minFrequencyHz", 0, nyq);
  assertInRange(maxF, "maxFrequencyHz", 0, nyq);
  if (minF >= maxF) throw new RangeError(`minFrequencyHz must be < maxFrequencyHz (got ${minF} ≥ ${maxF})`);
  let bands: [number, number][] | null = null;
  if (options.bandsHz !== undefined) {
    if (!Array.isArray(options.bandsHz) || options.bandsHz.length === 0) throw new TypeError(`bandsHz must be a non-empty array of [lo, hi] (got ${describe(options.bandsHz)})`);
    bands = options.bandsHz.map((b, i) => {
      if (!Array.isArray(b) || b.length !== 2) throw new TypeError(`bandsHz[${i}] must be [lo, hi] (got ${describe(b)})`);
      assertFiniteNumber(b[0], `bandsHz[${i}][0]`);
      assertFiniteNumber(b[1], `bandsHz[${i}][1]`);
      if (!(b[0] >= 0 && b[0] < b[1])) throw new RangeError(`bandsHz[${i}] must satisfy 0 ≤ lo < hi (got ${b[0]}–${b[1]})`);
      if (b[0] > nyq) throw new RangeError(`bandsHz[${i}] must start below Nyquist ${nyq} Hz (got ${b[0]})`);
      return [b[0], b[1]] as [number, number];
    });
  }
  const minProminenceDb = options.minProminenceDb ?? 2;
  assertFiniteNumber(minProminenceDb, "minProminenceDb");
  if (minProminenceDb <= 0) throw new RangeError(`minProminenceDb must be > 0 (got ${minProminenceDb})`);
  const minDominanceDb = options.minDominanceDb ?? 10;
  assertFiniteNumber(minDominanceDb, "minDominanceDb");
  if (minDominanceDb < 0) throw new RangeError(`minDominanceDb must be ≥ 0 (got ${minDominanceDb})`);
  const strongProminenceDb = options.strongProminenceDb ?? 10;
  assertFiniteNumber(strongProminenceDb, "strongProminenceDb");
  if (strongProminenceDb <= 0) throw new RangeError(`strongProminenceDb must be > 0 (got ${strongProminenceDb})`);
  const minCoherence = options.minCoherence ?? 0.9;
  assertInRange(minCoherence, "minCoherence", 0, 1);
  const closeModeDb = options.closeModeDb ?? 6;
  assertFiniteNumber(closeModeDb, "closeModeDb");
  if (closeModeDb <= 0) throw new RangeError(`closeModeDb must be > 0 (got ${closeModeDb})`);
  const maxModes = options.maxModes ?? 20;
  assertInteger(maxModes, "maxModes", 1);
  // With bands, search the union of the bands (widened by a line) instead of the default range.
  let kMin = Math.max(1, Math.ceil(minF / df));
  let kMax = Math.min(fdd.nLines - 2, Math.floor(maxF / df));
  if (bands) {
    kMin = Math.max(1, Math.floor(Math.min(...bands.map((b) => b[0])) / df) - 1);
    kMax = Math.min(fdd.nLines - 2, Math.ceil(Math.max(...bands.map((b) => b[1])) / df) + 1);
  }
  return { bands, kMin, kMax, minProminenceDb, minDominanceDb, strongProminenceDb, minCoherence, closeModeDb, maxModes };
}

function toDb(s: Float64Array): Float64Array {
  let max = 0;
  for (let k = 0; k < s.length; k++) if (s[k] > max) max = s[k];
  const floor = max > 0 ? max * 1e-30 : 1e-300; // keeps log finite on exact zeros
  const out = new Float64Array(s.length);
  for (let k = 0; k < s.length; k++) out[k] = 10 * Math.log10(s[k] + floor);
  return out;
}

/** A local maximum and how far the spectrum falls on each side before rising above it. */
export interface ProminenceInfo {
  line: number;
  prominence: number;
  leftFall: number;
  rightFall: number;
}

/**
 * Local maxima within [kMin, kMax] and their prominence over the whole spectrum (SciPy's
 * `peak_prominences` definition), as [line, prominence] pairs (internal helper, also used by
 * the FRF peak picking; trusts its arguments).
 */
export function prominences(y: ArrayLike<number>, kMin: number, kMax: number): [number, number][] {
  return peakSides(y, kMin, kMax).map((p) => [p.line, p.prominence]);
}

/** Local maxima within [kMin, kMax] with prominence and the fall on each side (internal helper). */
export function peakSides(y: ArrayLike<number>, kMin: number, kMax: number): ProminenceInfo[] {
  const out: ProminenceInfo[] = [];
  const n = y.length;
  for (let k = Math.max(1, kMin); k <= Math.min(n - 2, kMax); k++) {
    if (!(y[k] > y[k - 1] && y[k] >= y[k + 1])) continue;
    let leftMin = y[k];
    for (let i = k - 1; i >= 0 && y[i] <= y[k]; i--) if (y[i] < leftMin) leftMin = y[i];
    let rightMin = y[k];
    for (let i = k + 1; i < n && y[i] <= y[k]; i++) if (y[i] < rightMin) rightMin = y[i];
    out.push({ line: k, prominence: y[k] - Math.max(leftMin, rightMin), leftFall: y[k] - leftMin, rightFall: y[k] - rightMin });
  }
  return out;
}

/**
 * True when the vector at the peak differs (MAC < 0.8) from the vector at the higher peak
 * that limits its shallow side: a wiggle on the flank of a mode carries that mode's shape,
 * a weak or close mode does not [practice].
 */
function differsFromNeighbour(fdd: FddDecomposition, y: Float64Array, c: ProminenceInfo): boolean {
  const dir = c.leftFall < c.rightFall ? -1 : 1;
  let i = c.line + dir;
  while (i > 0 && i < y.length - 1 && y[i] <= y[c.line]) i += dir;
  while (i > 0 && i < y.length - 1 && y[i + dir] > y[i]) i += dir; // climb to the neighbouring peak
  const n = fdd.nChannels;
  const o = c.line * fdd.nVectors * n;
  return macWithVector(fdd, i, 0, fdd.vectorsRe.subarray(o, o + n), fdd.vectorsIm.subarray(o, o + n)) < 0.8;
}

/** Mean MAC of the rank-r vector at line k with those within ±reach lines. */
function coherence(fdd: FddDecomposition, k: number, rank: number, reach: number): number {
  const n = fdd.nChannels;
  const o = (k * fdd.nVectors + rank) * n;
  const re = fdd.vectorsRe.subarray(o, o + n);
  const im = fdd.vectorsIm.subarray(o, o + n);
  let sum = 0;
  let cnt = 0;
  for (let d = -reach; d <= reach; d++) {
    const j = k + d;
    if (d === 0) continue;
    if (j < 0 || j >= fdd.nLines) continue;
    sum += macWithVector(fdd, j, rank, re, im);
    cnt++;
  }
  return cnt ? sum / cnt : 0;
}

/** Vertex of the parabola through (k−1, k, k+1) of y, in Hz. */
function refine(y: Float64Array, k: number, df: number): number {
  const a = y[k - 1], b = y[k], c = y[k + 1];
  const den = a - 2 * b + c;
  const p = den < 0 ? (0.5 * (a - c)) / den : 0;
  return (k + Math.max(-0.5, Math.min(0.5, p))) * df;
}

function addCloseModes(fdd: FddDecomposition, peaks: FddPeak[], o: Resolved): FddPeak[] {
  const s2 = fdd.singularValues[1];
  const db2 = toDb(s2);
  const out = peaks.map((p) => ({ ...p }));
  const extra: FddPeak[] = [];
  const n = fdd.nChannels;
  for (const p of out) {
    // Window: ±8 lines for the s₂ peak, ±40 lines for its background median [practice].
    const lo = Math.max(1, p.line - 8), hi = Math.min(fdd.nLines - 2, p.line + 8);
    let best = -1;
    for (let k = lo; k <= hi; k++) if (db2[k] > db2[k - 1] && db2[k] >= db2[k + 1] && (best < 0 || db2[k] > db2[best])) best = k;
    if (best < 0) continue;
    const bg = median(db2, Math.max(1, p.line - 40), Math.min(fdd.nLines - 1, p.line + 40));
    if (db2[best] - bg < o.closeModeDb) continue;
    p.possiblyCoupled = true;
    const v = { re: fdd.vectorsRe.subarray((best * fdd.nVectors + 1) * n, (best * fdd.nVectors + 2) * n), im: fdd.vectorsIm.subarray((best * fdd.nVectors + 1) * n, (best * fdd.nVectors + 2) * n) };
    const distinct = [...out, ...extra].every((q) => macWithVector(fdd, q.line, q.rank, v.re, v.im) < 0.8);
    const coh2 = coherence(fdd, best, 1, 1);
    if (distinct && coh2 >= 0.8) {
      extra.push({ line: best, frequencyHz: refine(db2, best, fdd.lineSpacingHz), rank: 1, prominenceDb: db2[best] - bg, coherence: coh2, possiblyCoupled: true, band: p.band });
    }
  }
  return [...out, ...extra];
}

function median(y: Float64Array, lo: number, hi: number): number {
  const a = Array.from(y.subarray(lo, hi + 1)).sort((x, z) => x - z);
  return a[Math.floor(a.length / 2)];
}
