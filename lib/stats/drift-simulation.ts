/**
 * Simulated multi-year history of one asset for drift tests and the drift evaluation.
 *
 * Air temperature = annual cycle + daily cycle + synoptic weather (AR(1), a few days of
 * memory); the structure follows it through a first-order lag (time constant τ) and the
 * gateway measures the structure temperature with sensor noise. Each mode's frequency
 * follows the bilinear relation of lib/simulate (stiffening below 0 °C [1]), times an
 * unmodelled environmental factor (daily AR(1)), times √(1 − loss) after the damage onset
 * (frequency ∝ √stiffness), plus estimation noise per record. A fraction of records fails
 * data quality.
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 */
import { assertFiniteNumber, assertInRange, assertInteger, assertPositive } from "@/lib/numeric/validate";
import { createRng } from "@/lib/simulate/rng";
import { frequencyAtTemperature, type TemperatureSensitivity } from "@/lib/simulate/temperature";
import type { AssetHistory } from "./drift-monitor";

/** Scenario of {@link simulateDriftHistory}; every field but `seed` has a default. */
export interface DriftScenario {
  seed: number;
  /** Start of the history, ms UTC (default 2024-01-01). */
  startMs?: number;
  /** Length in days (default 730) and records per day (default 8). */
  days?: number;
  recordsPerDay?: number;
  /** Modes: frequency at 20 °C and bilinear sensitivity (defaults: three modes). */
  modes?: { f20Hz: number; sensitivity: TemperatureSensitivity }[];
  /** Day of the damage onset (fractional allowed), or null for none (default null). */
  onsetDay?: number | null;
  /** Stiffness loss fraction after the onset, in [0, 0.5) (default 0.02). */
  stiffnessLoss?: number;
  /** Relative estimation noise per record (default 0.003) and unmodelled daily factor (default 0.0008). */
  noiseRel?: number;
  environmentRel?: number;
  /** Climate: annual mean, annual amplitude, daily amplitude, weather sd (°C). */
  climate?: { meanC: number; annualAmpC: number; dailyAmpC: number; weatherSdC: number };
  /** Structure lag time constant, hours (default 4); sensor noise sd, °C (default 0.3). */
  lagHours?: number;
  sensorNoiseC?: number;
  /** Probability that a record fails data quality (default 0.02). */
  rejectProbability?: number;
}

export const DEFAULT_DRIFT_MODES: ReadonlyArray<{ f20Hz: number; sensitivity: TemperatureSensitivity }> = [
  { f20Hz: 2.1, sensitivity: { slopePerC: -0.0015, knotC: 0, coldSlopePerC: -0.006 } },
  { f20Hz: 5.8, sensitivity: { slopePerC: -0.001, knotC: 0, coldSlopePerC: -0.004 } },
  { f20Hz: 9.4, sensitivity: { slopePerC: -0.002, knotC: 0, coldSlopePerC: -0.008 } },
];

/**
 * Simulates an asset history (see header).
 *
 * @param scenario - see {@link DriftScenario}.
 * @returns the history (records in time order, modes "mode-1"…) and the onset time (ms UTC or null).
 * @throws TypeError / RangeError for values outside the documented ranges.
 */
export function simulateDriftHistory(scenario: DriftScenario): { history: AssetHistory; onsetMs: number | null } {
  assertFiniteNumber(scenario.seed, "seed");
  const startMs = scenario.startMs ?? Date.UTC(2024, 0, 1);
  const days = scenario.days ?? 730;
  const perDay = scenario.recordsPerDay ?? 8;
  assertInteger(days, "days", 1, 20000);
  assertInteger(perDay, "recordsPerDay", 1, 144);
  const loss = scenario.stiffnessLoss ?? 0.02;
  assertInRange(loss, "stiffnessLoss", 0, 0.499);
  const onset = scenario.onsetDay ?? null;
  if (onset !== null) assertFiniteNumber(onset, "onsetDay");
  const noise = scenario.noiseRel ?? 0.003;
  const envRel = scenario.environmentRel ?? 0.0008;
  assertInRange(noise, "noiseRel", 0, 0.1);
  assertInRange(envRel, "environmentRel", 0, 0.1);
  const climate = scenario.climate ?? { meanC: 9, annualAmpC: 11, dailyAmpC: 4, weatherSdC: 3 };
  const tau = scenario.lagHours ?? 4;
  assertPositive(tau, "lagHours");
  const sensor = scenario.sensorNoiseC ?? 0.3;
  const reject = scenario.rejectProbability ?? 0.02;
  assertInRange(reject, "rejectProbability", 0, 1);
  const modes = scenario.modes ?? DEFAULT_DRIFT_MODES;
  const rng = createRng(scenario.seed);

  const n = days * perDay;
  const dtH = 24 / perDay;
  const timesMs = new Float64Array(n);
  const temperatureC = new Float64Array(n);
  const qualityPassed = new Uint8Array(n);
  const freqs = modes.map(() => new Float64Array(n));
  const phiW = Math.exp(-dtH / 72); // weather memory ≈ 3 days
  const phiS = Math.exp(-dtH / tau);
  const phiE = 0.7; // day-to-day memory of the unmodelled factor
  let weather = rng.normal() * climate.weatherSdC;
  let structC = Number.NaN;
  let env = modes.map(() => rng.normal() * envRel);
  for (let i = 0; i < n; i++) {
    const tDays = i / perDay;
    if (i % perDay === 0 && i > 0) env = env.map((e) => phiE * e + Math.sqrt(1 - phiE * phiE) * envRel * rng.normal());
    weather = phiW * weather + Math.sqrt(1 - phiW * phiW) * climate.weatherSdC * rng.normal();
    const air = climate.meanC - climate.annualAmpC * Math.cos((2 * Math.PI * (tDays - 15)) / 365.25)
      - climate.dailyAmpC * Math.cos((2 * Math.PI * ((tDays % 1) * 24 - 3)) / 24) + weather;
    structC = Number.isNaN(structC) ? air : phiS * structC + (1 - phiS) * air;
    timesMs[i] = startMs + tDays * 86_400_000;
    temperatureC[i] = structC + sensor * rng.normal();
    qualityPassed[i] = rng.next() < reject ? 0 : 1;
    const damage = onset !== null && tDays >= onset ? Math.sqrt(1 - loss) : 1;
    modes.forEach((m, j) => {
      const f = frequencyAtTemperature(m.f20Hz, Math.max(-60, Math.min(80, structC)), m.sensitivity);
      freqs[j][i] = f * damage * (1 + env[j]) * (1 + noise * rng.normal());
    });
  }
  return {
    history: { timesMs, temperatureC, qualityPassed, modes: freqs.map((f, j) => ({ modeId: `mode-${j + 1}`, frequencyHz: f })) },
    onsetMs: onset === null ? null : startMs + onset * 86_400_000,
  };
}
