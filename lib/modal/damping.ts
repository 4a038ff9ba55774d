/**
 * Conversions between the damping measures reported beside each other [REFERENCES.md]:
 * viscous damping ratio ζ, quality factor Q = 1/(2ζ), loss factor η = 2ζ = 1/Q
 * [Chopra, Dynamics of Structures, ch. 3] and logarithmic decrement δ with
 * ζ = δ/√(4π² + δ²), i.e. δ = 2πζ/√(1 − ζ²).
 */
import { assertFiniteNumber } from "@/lib/numeric/validate";

function assertRatio(zeta: unknown): asserts zeta is number {
  assertFiniteNumber(zeta, "dampingRatio");
  if (!(zeta > 0 && zeta < 1)) throw new RangeError(`dampingRatio must be within (0, 1) (got ${zeta})`);
}

/** Quality factor Q = 1/(2ζ). @param dampingRatio - ζ in (0, 1). @throws TypeError/RangeError otherwise. */
export function qualityFactor(dampingRatio: number): number {
  assertRatio(dampingRatio);
  return 1 / (2 * dampingRatio);
}

/** Loss factor η = 2ζ. @param dampingRatio - ζ in (0, 1). @throws TypeError/RangeError otherwise. */
export function lossFactor(dampingRatio: number): number {
  assertRatio(dampingRatio);
  return 2 * dampingRatio;
}

/** Logarithmic decrement δ = 2πζ/√(1−ζ²). @param dampingRatio - ζ in (0, 1). @throws TypeError/RangeError otherwise. */
export function logDecrementFromDampingRatio(dampingRatio: number): number {
  assertRatio(dampingRatio);
  return (2 * Math.PI * dampingRatio) / Math.sqrt(1 - dampingRatio * dampingRatio);
}

/** Damping ratio ζ = δ/√(4π²+δ²). @param logDecrement - δ > 0. @throws TypeError/RangeError otherwise. */
export function dampingRatioFromLogDecrement(logDecrement: number): number {
  assertFiniteNumber(logDecrement, "logDecrement");
  if (!(logDecrement > 0)) throw new RangeError(`logDecrement must be > 0 (got ${logDecrement})`);
  return logDecrement / Math.sqrt(4 * Math.PI * Math.PI + logDecrement * logDecrement);
}
