/**
 * Temperature dependence of a natural frequency, for the demo history and drift tests.
 *
 * Method: bilinear relation [1]: above a knot temperature (about 0 °C, where asphalt and
 * wet materials freeze and the structure stiffens sharply) the frequency varies linearly
 * with a small slope; below the knot with a different, usually much steeper one:
 *   T ≥ T_k: f = f₂₀·(1 + s·(T − 20))
 *   T <  T_k: f = f₂₀·(1 + s·(T_k − 20) + s_c·(T − T_k))
 * continuous at T_k. Slopes are relative (per °C); the sign and size differ per structure
 * and mode [1] (a typical steel or concrete footbridge: s ≈ −0.1 %/°C to −0.3 %/°C,
 * s_c several times steeper and negative, i.e. frequency rising as it gets colder).
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 */
import { assertFiniteNumber, assertInRange, assertPositive } from "@/lib/numeric/validate";

/** Parameters of the bilinear frequency–temperature relation. */
export interface TemperatureSensitivity {
  /** Relative slope above the knot, 1/°C (e.g. −0.002 = −0.2 %/°C), within [−0.1, 0.1]. */
  slopePerC: number;
  /** Knot temperature in °C, default 0, within [−40, 40]. */
  knotC?: number;
  /** Relative slope below the knot, 1/°C, within [−0.1, 0.1]; default = slopePerC (linear). */
  coldSlopePerC?: number;
}

/**
 * Natural frequency at a temperature from its value at 20 °C (bilinear model, see header).
 *
 * @param f20 - frequency at 20 °C in Hz, > 0.
 * @param temperatureC - structure temperature in °C, within [−60, 80].
 * @param sensitivity - slopes and knot, see {@link TemperatureSensitivity}.
 * @returns frequency in Hz.
 * @throws TypeError for non-numbers; RangeError for values outside the stated ranges or a
 *   combination that gives a frequency ≤ 0.
 */
export function frequencyAtTemperature(f20: number, temperatureC: number, sensitivity: TemperatureSensitivity): number {
  assertPositive(f20, "f20");
  assertInRange(temperatureC, "temperatureC", -60, 80);
  if (typeof sensitivity !== "object" || sensitivity === null) {
    throw new TypeError(`sensitivity must be an object (got ${String(sensitivity)})`);
  }
  assertInRange(sensitivity.slopePerC, "slopePerC", -0.1, 0.1);
  const knot = sensitivity.knotC ?? 0;
  assertInRange(knot, "knotC", -40, 40);
  const cold = sensitivity.coldSlopePerC ?? sensitivity.slopePerC;
  assertFiniteNumber(cold, "coldSlopePerC");
  assertInRange(cold, "coldSlopePerC", -0.1, 0.1);
  const s = sensitivity.slopePerC;
  const rel = temperatureC >= knot ? 1 + s * (temperatureC - 20) : 1 + s * (knot - 20) + cold * (temperatureC - knot);
  if (!(rel > 0)) throw new RangeError(`the slopes give a non-positive frequency at ${temperatureC} °C (factor ${rel})`);
  return f20 * rel;
}
