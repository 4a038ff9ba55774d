/**
 * Forced vibration tests (shaker or hammer) of a structure with known modes, with the
 * measured force channel, for FRF estimation.
 *
 * Method: modal superposition [1]. A force F(t) at the drive point d gives each mode the
 * modal force φ_j(d)·F/M_j (M_j the modal mass for the shape as given); each modal oscillator
 * is integrated by the exact first-order-hold recursion of sdof-discrete.ts [2], so the
 * sampled force and the sampled accelerations are related by the discretised FRF, which
 * follows the continuous accelerance
 *   H_cd(ω) = Σ_j φ_j(c)φ_j(d)/M_j · (−ω²)/(ω_j² − ω² + 2jζ_jω_jω)
 * within ≈ (2πf/fs)²/12 in power (≤ 0.9 % below fs/20). Random excitation starts after a
 * discarded run-in of five time constants 1/(ζω) of the slowest-decaying mode, so the record
 * is stationary; hammer records start at rest.
 *
 * [1] Chopra, Dynamics of Structures (modal superposition, frequency response).
 * [2] Franklin, Powell & Workman, Digital Control of Dynamic Systems, ch. 4 & 6.
 */
import { assertFiniteNumber, assertInteger, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import type { SimulatedMode } from "./ambient";
import { createRng, type Rng } from "./rng";
import { runSdof, sdofRecursion } from "./sdof-discrete";

/** Excitation of a forced test. */
export type ForcedExcitation =
  /** Gaussian white force samples (shaker driven by random noise), RMS in N. */
  | { kind: "random"; forceRmsN: number }
  /** Half-sine impacts of `peakForceN` lasting `pulseWidthS`, one every `intervalS` (±10 % jitter). */
  | { kind: "hammer"; peakForceN: number; pulseWidthS: number; intervalS: number };

/** Options of {@link simulateForcedTest}. */
export interface ForcedTestOptions {
  /** Modes (frequency Hz < fs/2, ζ in (0, 1), real shape per response channel), ≥ 1. */
  modes: SimulatedMode[];
  /** Modal masses in kg for the shapes as given, one per mode, > 0; default 1000 each. */
  modalMassKg?: number[];
  /** Index of the response channel at the drive point (where the force acts). */
  driveChannel: number;
  /** Sampling rate in Hz, > 0. */
  sampleRateHz: number;
  /** Record length in s, > 0 (≥ 16 samples, ≤ 5·10⁷). */
  durationS: number;
  /** Seed of the random generator. */
  seed: number;
  /** Force history. */
  excitation: ForcedExcitation;
  /** SNR in dB of white noise on the response channels; default Infinity (none). */
  responseSnrDb?: number;
  /** SNR in dB of white noise on the force channel; default Infinity (none). */
  forceSnrDb?: number;
}

/** A simulated forced test. */
export interface ForcedTestRecord {
  /** Measured force in N, one sample per instant. */
  force: Float64Array;
  /** Absolute accelerations in m/s², one array per response channel. */
  data: Float64Array[];
  warnings: string[];
}

/**
 * Simulates a forced vibration test (see file header).
 *
 * @param opts - see {@link ForcedTestOptions}.
 * @returns force and response channels (new arrays) and warnings.
 * @throws TypeError for a wrong kind of option; RangeError for a frequency ≥ Nyquist, a
 *   damping ratio outside (0, 1), unequal shape lengths, a drive channel out of range, a
 *   hammer pulse shorter than two samples or longer than its interval.
 */
export function simulateForcedTest(opts: ForcedTestOptions): ForcedTestRecord {
  validateForced(opts);
  const fs = opts.sampleRateHz;
  const h = 1 / fs;
  const n = Math.round(opts.durationS * fs);
  const nCh = opts.modes[0].shape.length;
  const rng = createRng(opts.seed);
  const warnings: string[] = [];
  const slowest = Math.max(...opts.modes.map((m) => 1 / (m.dampingRatio * 2 * Math.PI * m.frequencyHz)));
  const runIn = opts.excitation.kind === "random" ? Math.ceil(5 * slowest * fs) : 0;
  const total = runIn + n;
  const force = opts.excitation.kind === "random" ? randomForce(total + 1, opts.excitation.forceRmsN, rng) : hammerForce(total + 1, fs, opts.excitation, rng);

  const data = Array.from({ length: nCh }, () => new Float64Array(n));
  const p = new Float64Array(total + 1);
  opts.modes.forEach((mode, j) => {
    const omega = 2 * Math.PI * mode.frequencyHz;
    const gain = mode.shape[opts.driveChannel] / (opts.modalMassKg?.[j] ?? 1000);
    if (gain === 0) warnings.push(`mode ${j} has a node at the drive point and is not excited`);
    for (let k = 0; k <= total; k++) p[k] = gain * force[k];
    const acc = runSdof(sdofRecursion(omega, mode.dampingRatio, h), omega, mode.dampingRatio, p, total, 0, 0, false).acceleration;
    for (let c = 0; c < nCh; c++) {
      const phi = mode.shape[c];
      for (let k = 0; k < n; k++) data[c][k] += phi * acc[runIn + k];
    }
  });
  const measuredForce = force.slice(runIn, runIn + n);
  addNoise(data, opts.responseSnrDb ?? Infinity, rng);
  addNoise([measuredForce], opts.forceSnrDb ?? Infinity, rng);
  return { force: measuredForce, data, warnings };
}

function randomForce(n: number, rms: number, rng: Rng): Float64Array {
  const f = new Float64Array(n);
  for (let k = 0; k < n; k++) f[k] = rms * rng.normal();
  return f;
}

function hammerForce(n: number, fs: number, e: Extract<ForcedExcitation, { kind: "hammer" }>, rng: Rng): Float64Array {
  const f = new Float64Array(n);
  const width = Math.round(e.pulseWidthS * fs);
  let t = 0.1 * e.intervalS;
  while (Math.round(t * fs) + width < n) {
    const k0 = Math.round(t * fs);
    for (let i = 0; i <= width; i++) f[k0 + i] += e.peakForceN * Math.sin((Math.PI * i) / width);
    t += e.intervalS * (0.9 + 0.2 * rng.next());
  }
  return f;
}

function addNoise(chs: Float64Array[], snrDb: number, rng: Rng): void {
  if (snrDb === Infinity) return;
  for (const y of chs) {
    let ss = 0;
    for (let k = 0; k < y.length; k++) ss += y[k] * y[k];
    const sd = Math.sqrt(ss / y.length) * 10 ** (-snrDb / 20);
    for (let k = 0; k < y.length; k++) y[k] += sd * rng.normal();
  }
}

function validateForced(o: ForcedTestOptions): void {
  if (typeof o !== "object" || o === null) throw new TypeError(`opts must be an object (got ${describe(o)})`);
  if (!Array.isArray(o.modes) || o.modes.length === 0) throw new TypeError(`modes must be a non-empty array (got ${describe(o.modes)})`);
  assertPositive(o.sampleRateHz, "sampleRateHz");
  assertPositive(o.durationS, "durationS");
  assertFiniteNumber(o.seed, "seed");
  const n = Math.round(o.durationS * o.sampleRateHz);
  if (n < 16 || n > 5e7) throw new RangeError(`durationS·sampleRateHz must give 16 … 5e7 samples (got ${n})`);
  const nCh = o.modes[0]?.shape?.length;
  o.modes.forEach((m, j) => {
    assertPositive(m?.frequencyHz, `modes[${j}].frequencyHz`);
    if (m.frequencyHz >= o.sampleRateHz / 2) throw new RangeError(`modes[${j}].frequencyHz must be < sampleRateHz/2 = ${o.sampleRateHz / 2} (got ${m.frequencyHz})`);
    assertFiniteNumber(m.dampingRatio, `modes[${j}].dampingRatio`);
    if (!(m.dampingRatio > 0 && m.dampingRatio < 1)) throw new RangeError(`modes[${j}].dampingRatio must be within (0, 1) (got ${m.dampingRatio})`);
    assertNumberArray(m.shape, `modes[${j}].shape`);
    if (m.shape.length !== nCh) throw new RangeError(`modes[${j}].shape must have ${nCh} entries like modes[0] (got ${m.shape.length})`);
  });
  assertInteger(o.driveChannel, "driveChannel", 0, nCh - 1);
  if (o.modalMassKg !== undefined) {
    assertNumberArray(o.modalMassKg, "modalMassKg");
    if (o.modalMassKg.length !== o.modes.length) throw new RangeError(`modalMassKg must have one entry per mode (got ${o.modalMassKg.length} ≠ ${o.modes.length})`);
    o.modalMassKg.forEach((m, j) => assertPositive(m, `modalMassKg[${j}]`));
  }
  const e = o.excitation;
  if (typeof e !== "object" || e === null || (e.kind !== "random" && e.kind !== "hammer")) {
    throw new TypeError(`excitation.kind must be "random" or "hammer" (got ${describe((e as { kind?: unknown } | null)?.kind)})`);
  }
  if (e.kind === "random") assertPositive(e.forceRmsN, "excitation.forceRmsN");
  else {
    assertPositive(e.peakForceN, "excitation.peakForceN");
    assertPositive(e.pulseWidthS, "excitation.pulseWidthS");
    assertPositive(e.intervalS, "excitation.intervalS");
    if (e.pulseWidthS * o.sampleRateHz < 2) throw new RangeError(`excitation.pulseWidthS must span ≥ 2 samples (got ${e.pulseWidthS * o.sampleRateHz})`);
    if (e.pulseWidthS >= e.intervalS) throw new RangeError(`excitation.pulseWidthS must be < intervalS (got ${e.pulseWidthS} ≥ ${e.intervalS})`);
  }
  for (const [v, name] of [[o.responseSnrDb, "responseSnrDb"], [o.forceSnrDb, "forceSnrDb"]] as const) {
    if (v !== undefined && v !== Infinity) assertFiniteNumber(v, name);
  }
}
