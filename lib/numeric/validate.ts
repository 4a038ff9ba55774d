/**
 * Validation gates shared by the numerical library (CONVENTIONS.md §7): TypeError for the
 * wrong kind, RangeError for a wrong size or bound, the rule and the value in the message.
 */
import { isArrayLike } from "./complex";

/** Throws TypeError unless `x` is a finite number. */
export function assertFiniteNumber(x: unknown, name: string): asserts x is number {
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new TypeError(`${name} must be a finite number (got ${describe(x)})`);
  }
}

/** Throws unless `x` is an integer within [min, max]. */
export function assertInteger(x: unknown, name: string, min = -Infinity, max = Infinity): asserts x is number {
  if (typeof x !== "number" || !Number.isInteger(x)) {
    throw new TypeError(`${name} must be an integer (got ${describe(x)})`);
  }
  if (x < min) throw new RangeError(`${name} must be ≥ ${min} (got ${x})`);
  if (x > max) throw new RangeError(`${name} must be ≤ ${max} (got ${x})`);
}

/** Throws unless `x` is a finite number strictly greater than `min`. */
export function assertPositive(x: unknown, name: string, min = 0): asserts x is number {
  assertFiniteNumber(x, name);
  if (!(x > min)) throw new RangeError(`${name} must be > ${min} (got ${x})`);
}

/** Throws unless `x` is a finite number within [lo, hi]. */
export function assertInRange(x: unknown, name: string, lo: number, hi: number): asserts x is number {
  assertFiniteNumber(x, name);
  if (x < lo || x > hi) throw new RangeError(`${name} must be within [${lo}, ${hi}] (got ${x})`);
}

/**
 * Throws unless `x` is an array-like of numbers with at least `minLength` elements;
 * with `finite` every element must be finite.
 */
export function assertNumberArray(
  x: unknown,
  name: string,
  minLength = 1,
  finite = true,
): asserts x is ArrayLike<number> {
  if (!isArrayLike(x)) throw new TypeError(`${name} must be an array of numbers (got ${describe(x)})`);
  if (x.length < minLength) {
    throw new RangeError(`${name} must have at least ${minLength} element(s) (got ${x.length})`);
  }
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (typeof v !== "number" || (finite && !Number.isFinite(v))) {
      throw new TypeError(`${name} must hold ${finite ? "finite " : ""}numbers (got ${describe(v)} at index ${i})`);
    }
  }
}

/** Short description of a value for error messages. */
export function describe(x: unknown): string {
  if (x === null) return "null";
  if (Array.isArray(x)) return `array(${x.length})`;
  if (typeof x === "number") return String(x);
  if (typeof x === "string") return JSON.stringify(x.length > 40 ? `${x.slice(0, 40)}…` : x);
  if (typeof x === "object") return (x as object).constructor?.name ?? "object";
  return typeof x;
}
