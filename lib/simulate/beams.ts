/**
 * Bending modes of uniform Euler–Bernoulli beams, sampled at sensor positions.
 *
 * f_n = (β_nL)² / (2πL²) · √(EI/m) [1]. Simply supported: β_nL = nπ, φ_n = sin(nπx/L).
 * Cantilever (clamped at x = 0, free at x = L): β_nL solves 1 + cos βL · cosh βL = 0, and
 * φ_n = cosh βx − cos βx − σ_n (sinh βx − sin βx), σ_n = (sinh βL − sin βL)/(cosh βL + cos βL)
 * [1]. The cantilever shape is evaluated in a cancellation-free form (see cantileverShape),
 * because cosh βx and σ sinh βx each grow like e^{βx} while their difference stays O(1).
 *
 * [1] Blevins, Formulas for Natural Frequency and Mode Shape (β_nL: cantilever 1.875104,
 *     4.694091, 7.854757; simply supported nπ).
 */
import { assertFiniteNumber, assertInteger, assertNumberArray, assertPositive } from "@/lib/numeric/validate";
import type { StructuralMode } from "./modes";

/** Geometry, stiffness, mass and sensor layout of a uniform beam. */
export interface BeamOptions {
  /** Span (simply supported) or free length (cantilever) L in m, > 0. */
  lengthM: number;
  /** Flexural rigidity EI in N·m², > 0. */
  flexuralRigidityNm2: number;
  /** Mass per unit length m in kg/m, > 0. */
  massPerLengthKgPerM: number;
  /** Sensor positions x in m, each within [0, L]; at least one. */
  sensorPositionsM: number[];
  /** Number of modes to return, integer in [1, 50]. */
  modeCount: number;
}

function validateBeam(o: BeamOptions): void {
  if (typeof o !== "object" || o === null) throw new TypeError(`options must be an object (got ${String(o)})`);
  assertPositive(o.lengthM, "lengthM");
  assertPositive(o.flexuralRigidityNm2, "flexuralRigidityNm2");
  assertPositive(o.massPerLengthKgPerM, "massPerLengthKgPerM");
  assertNumberArray(o.sensorPositionsM, "sensorPositionsM");
  assertInteger(o.modeCount, "modeCount", 1, 50);
  o.sensorPositionsM.forEach((x, i) => {
    assertFiniteNumber(x, `sensorPositionsM[${i}]`);
    if (x < 0 || x > o.lengthM) {
      throw new RangeError(`sensorPositionsM[${i}] must be within [0, ${o.lengthM}] m (got ${x})`);
    }
  });
}

function frequencyHz(betaL: number, o: BeamOptions): number {
  const l = o.lengthM;
  return ((betaL * betaL) / (2 * Math.PI * l * l)) * Math.sqrt(o.flexuralRigidityNm2 / o.massPerLengthKgPerM);
}

/**
 * Modes of a uniform simply supported Euler–Bernoulli beam [1].
 *
 * @param options - beam properties and sensor positions, see {@link BeamOptions}.
 * @returns `modeCount` modes, ascending; `shape[s] = sin(nπ x_s / L)` (continuous maximum 1,
 *   first antinode positive), so sampled values may be below 1 or zero at a node.
 * @throws TypeError / RangeError for a non-positive property, a sensor off the beam or a
 *   mode count outside [1, 50].
 */
export function simplySupportedBeamModes(options: BeamOptions): StructuralMode[] {
  validateBeam(options);
  const modes: StructuralMode[] = [];
  for (let n = 1; n <= options.modeCount; n++) {
    const k = (n * Math.PI) / options.lengthM;
    modes.push({
      frequencyHz: frequencyHz(n * Math.PI, options),
      shape: options.sensorPositionsM.map((x) => Math.sin(k * x)),
    });
  }
  return modes;
}

/**
 * Root n (1-based) of 1 + cos z · cosh z = 0, by Newton's method on the bounded form
 * g(z) = cos z + 1/cosh z, started at (2n−1)π/2 (n ≥ 2) or 1.875 (n = 1). Internal helper.
 */
export function cantileverBetaL(n: number): number {
  let z = n === 1 ? 1.875 : ((2 * n - 1) * Math.PI) / 2;
  for (let it = 0; it < 50; it++) {
    const g = Math.cos(z) + 1 / Math.cosh(z);
    const dg = -Math.sin(z) - Math.tanh(z) / Math.cosh(z);
    const step = g / dg;
    z -= step;
    if (Math.abs(step) <= 4 * Number.EPSILON * z) break;
  }
  return z;
}

/**
 * Cantilever shape at ξ = βx for root b = βL, scaled so that the tip value is +1.
 * cosh ξ − σ sinh ξ = ((1−σ)e^ξ + (1+σ)e^{−ξ})/2 with
 * 1 − σ = (e^{−b} + cos b + sin b)/(cosh b + cos b), which stays accurate for large b.
 */
function cantileverShape(b: number, xi: number): number {
  const den = Math.cosh(b) + Math.cos(b);
  const sigma = (Math.sinh(b) - Math.sin(b)) / den;
  const oneMinusSigma = (Math.exp(-b) + Math.cos(b) + Math.sin(b)) / den;
  const raw = (xi: number): number =>
    0.5 * (oneMinusSigma * Math.exp(xi) + (1 + sigma) * Math.exp(-xi)) - Math.cos(xi) + sigma * Math.sin(xi);
  return raw(xi) / raw(b);
}

/**
 * Modes of a uniform cantilever (clamped–free) Euler–Bernoulli beam [1].
 *
 * @param options - beam properties and sensor positions (x from the clamped end), see
 *   {@link BeamOptions}.
 * @returns `modeCount` modes, ascending; shapes scaled so the free tip is +1 (the continuous
 *   maximum of |φ|), sampled at the sensors.
 * @throws TypeError / RangeError as {@link simplySupportedBeamModes}.
 */
export function cantileverBeamModes(options: BeamOptions): StructuralMode[] {
  validateBeam(options);
  const modes: StructuralMode[] = [];
  for (let n = 1; n <= options.modeCount; n++) {
    const b = cantileverBetaL(n);
    const beta = b / options.lengthM;
    modes.push({
      frequencyHz: frequencyHz(b, options),
      shape: options.sensorPositionsM.map((x) => cantileverShape(b, beta * x)),
    });
  }
  return modes;
}
