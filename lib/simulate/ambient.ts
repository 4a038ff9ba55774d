/**
 * Ambient-vibration records of a structure with known modes.
 *
 * Method: modal superposition [1, ch. 12]. Each mode j is a unit-modal-mass oscillator
 * q̈ + 2ζω q̇ + ω² q = u_j(t) driven by its own band-limited white noise u_j (Gaussian
 * samples at the output rate, linear between samples), integrated by the exact
 * first-order-hold recursion of sdof-discrete.ts [2] (no integration error). The absolute
 * acceleration of channel c is y_c = Σ_j φ_j(c)·q̈_j (the structure is driven by forces,
 * not by base motion, so absolute and relative acceleration coincide). Each oscillator
 * starts from its stationary covariance [3] (q, q̇ uncorrelated with variances
 * S₀/(4ζω³), S₀/(4ζω)), so no transient has to be discarded. Sensor noise is white and
 * Gaussian at the requested SNR per channel.
 *
 * Forcing level: `modalForceStd[j]` = σ is the standard deviation of the modal force samples
 * per unit modal mass (m/s²); they are white with two-sided PSD S₀ = σ²/fs ((m/s²)²/Hz)
 * up to fs/2. The recursion is exact for the force interpolated linearly between samples,
 * which follows ideal white forcing within ≈ (2πf/fs)²/12 in PSD (≤ 0.9 % below fs/20,
 * ≈ 5 % at fs/8): keep modes of interest well below Nyquist (a warning is given above 0.4·fs).
 *
 * [1] Chopra, Dynamics of Structures (modal superposition).
 * [2] Franklin, Powell & Workman, Digital Control of Dynamic Systems, ch. 4 & 6.
 * [3] Crandall & Mark, Random Vibration in Mechanical Systems (σ_q² = S₀/(4ζω³)).
 */
import { applyDefects, type RecordDefect } from "./defects";
import { createRng } from "./rng";
import { runSdof, sdofRecursion } from "./sdof-discrete";
import { validateAmbientOptions } from "./ambient-validate";

/** A damped real mode to simulate. */
export interface SimulatedMode {
  /** Undamped natural frequency in Hz, 0 < f < sampleRateHz/2. */
  frequencyHz: number;
  /** Viscous damping ratio (fraction, not %), 0 < ζ < 1. */
  dampingRatio: number;
  /** Mode shape at the channels (dimensionless, real); its length sets the channel count. */
  shape: number[];
}

/** Options of {@link simulateAmbientRecord}. */
export interface AmbientOptions {
  /** Modes to superpose, ≥ 1, all shapes of one length (the channel count, 1…1024). */
  modes: SimulatedMode[];
  /** Output sampling rate in Hz, > 0. */
  sampleRateHz: number;
  /** Record length in s, > 0; the record has round(durationS·sampleRateHz) ≥ 16 samples. */
  durationS: number;
  /** Seed of the random generator (any finite number); same seed, same record. */
  seed: number;
  /** Sensor SNR in dB relative to each channel's signal RMS; default 40; Infinity = no noise. */
  snrDb?: number;
  /**
   * Std of each mode's force samples per unit modal mass in m/s², ≥ 0, one per mode.
   * Default: chosen per mode so that its resonant acceleration RMS, √(S₀ω/(4ζ)), is
   * 0.01 m/s²; every mode is then about equally visible.
   */
  modalForceStd?: number[];
  /** Multiplies every modal stiffness: frequencies scale by √factor; > 0, default 1. */
  stiffnessFactor?: number;
  /** Faults to inject after the sensor noise (see defects.ts). */
  defects?: RecordDefect[];
  /** Output quantity, default "acceleration" (m/s²); "velocity" (m/s), "displacement" (m). */
  quantity?: "acceleration" | "velocity" | "displacement";
}

/** A simulated record: one Float64Array per channel. */
export interface AmbientRecord {
  /** Channel histories, `data[c][k]` at t = k/fs, in the unit of `quantity`. */
  data: Float64Array[];
  /** The modes as simulated (frequencies after `stiffnessFactor`). */
  modes: SimulatedMode[];
  /** Conditions the caller should know about (mode near Nyquist, silent channel, cut defect). */
  warnings: string[];
}

/** Resonant acceleration RMS of each mode under the default forcing, m/s². */
const DEFAULT_MODAL_ACCELERATION_RMS = 0.01;

/**
 * Simulates an ambient-vibration record by exact modal superposition (see file header).
 *
 * @param opts - see {@link AmbientOptions}.
 * @returns the channels, the modes used and warnings.
 * @throws TypeError for a wrong kind of option; RangeError for a frequency at or above
 *   Nyquist, a damping ratio outside (0, 1), shapes of unequal length, a record shorter
 *   than 16 samples or longer than 5·10⁷, and the defect rules of applyDefects.
 * Cost: O(modes · channels · samples); 16 channels, 10 modes, 120 000 samples ≈ tens of ms.
 */
export function simulateAmbientRecord(opts: AmbientOptions): AmbientRecord {
  validateAmbientOptions(opts);
  const fs = opts.sampleRateHz;
  const h = 1 / fs;
  const n = Math.round(opts.durationS * fs);
  const nCh = opts.modes[0].shape.length;
  const sqrtFactor = Math.sqrt(opts.stiffnessFactor ?? 1);
  const quantity = opts.quantity ?? "acceleration";
  const rng = createRng(opts.seed);
  const warnings: string[] = [];
  const modes = opts.modes.map((m) => ({ ...m, frequencyHz: m.frequencyHz * sqrtFactor, shape: [...m.shape] }));

  const data = Array.from({ length: nCh }, () => new Float64Array(n));
  const u = new Float64Array(n + 1);
  modes.forEach((mode, j) => {
    const f = mode.frequencyHz;
    if (f >= fs / 2) throw new RangeError(`modes[${j}].frequencyHz × √stiffnessFactor must be < sampleRateHz/2 = ${fs / 2} (got ${f})`);
    if (f > 0.4 * fs) warnings.push(`mode ${j} at ${f.toFixed(3)} Hz is above 0.4·fs; its forcing is attenuated by the hold`);
    const omega = 2 * Math.PI * f;
    const zeta = mode.dampingRatio;
    const sigma = opts.modalForceStd?.[j] ?? Math.sqrt(((4 * zeta * DEFAULT_MODAL_ACCELERATION_RMS ** 2) / omega) * fs);
    const s0 = sigma * sigma * h; // two-sided PSD of the force, (m/s²)²/Hz
    for (let k = 0; k <= n; k++) u[k] = sigma * rng.normal();
    const q0 = Math.sqrt(s0 / (4 * zeta * omega ** 3)) * rng.normal();
    const v0 = Math.sqrt(s0 / (4 * zeta * omega)) * rng.normal();
    const hist = runSdof(sdofRecursion(omega, zeta, h), omega, zeta, u, n, q0, v0, quantity !== "acceleration");
    const out = quantity === "acceleration" ? hist.acceleration : quantity === "velocity" ? hist.velocity : hist.displacement;
    for (let c = 0; c < nCh; c++) {
      const phi = mode.shape[c];
      if (phi === 0) continue;
      const y = data[c];
      for (let k = 0; k < n; k++) y[k] += phi * out[k];
    }
  });

  addSensorNoise(data, opts.snrDb ?? 40, rng, warnings);
  if (opts.defects && opts.defects.length > 0) {
    const res = applyDefects(data, fs, opts.defects, rng);
    return { data: res.data, modes, warnings: [...warnings, ...res.warnings] };
  }
  return { data, modes, warnings };
}

/** Adds white Gaussian noise of RMS = signal RMS · 10^(−SNR/20) to each channel in place. */
function addSensorNoise(data: Float64Array[], snrDb: number, rng: ReturnType<typeof createRng>, warnings: string[]): void {
  data.forEach((y, c) => {
    let ss = 0;
    for (let k = 0; k < y.length; k++) ss += y[k] * y[k];
    const rms = Math.sqrt(ss / y.length);
    if (rms === 0) warnings.push(`channel ${c} has no modal response (it sits on a node of every mode)`);
    if (snrDb === Infinity || rms === 0) return;
    const sd = rms * 10 ** (-snrDb / 20);
    for (let k = 0; k < y.length; k++) y[k] += sd * rng.normal();
  });
}
