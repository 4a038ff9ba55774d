/**
 * Complex data in the numerical library is carried as two parallel real arrays
 * (CONVENTIONS.md §7): `re[i] + j·im[i]`. No object per element, so large spectra stay
 * in typed arrays and cost no allocation per sample.
 */

/** A complex vector as separate real and imaginary parts of equal length. */
export interface ComplexVector {
  re: ArrayLike<number>;
  im: ArrayLike<number>;
}

/** A mutable complex vector backed by typed arrays. */
export interface ComplexArray {
  re: Float64Array;
  im: Float64Array;
}

/** Allocates a zero complex vector of length `n` (internal helper; trusts its caller). */
export function complexZeros(n: number): ComplexArray {
  return { re: new Float64Array(n), im: new Float64Array(n) };
}

/**
 * Checks that `v` is a complex vector with equal-length, finite parts.
 *
 * @param v - candidate vector.
 * @param name - the argument name used in the error message.
 * @param minLength - the smallest accepted length (default 1).
 * @throws TypeError when `v` is not `{ re, im }` of array-likes or holds a non-finite value.
 * @throws RangeError when the parts differ in length or are shorter than `minLength`.
 */
export function assertComplexVector(v: unknown, name: string, minLength = 1): asserts v is ComplexVector {
  if (typeof v !== "object" || v === null) {
    throw new TypeError(`${name} must be an object { re, im } (got ${v === null ? "null" : typeof v})`);
  }
  const { re, im } = v as { re?: unknown; im?: unknown };
  if (!isArrayLike(re) || !isArrayLike(im)) {
    throw new TypeError(`${name}.re and ${name}.im must be arrays of numbers`);
  }
  if (re.length !== im.length) {
    throw new RangeError(`${name}.re and ${name}.im must have equal length (got ${re.length} ≠ ${im.length})`);
  }
  if (re.length < minLength) {
    throw new RangeError(`${name} must have at least ${minLength} element(s) (got ${re.length})`);
  }
  for (let i = 0; i < re.length; i++) {
    if (!Number.isFinite(re[i]) || !Number.isFinite(im[i])) {
      throw new TypeError(`${name} must hold finite numbers (got ${re[i]} + ${im[i]}j at index ${i})`);
    }
  }
}

/** True when `x` looks like an array of numbers (typed array or plain array). */
export function isArrayLike(x: unknown): x is ArrayLike<number> {
  return (
    Array.isArray(x) ||
    (ArrayBuffer.isView(x) && !(x instanceof DataView))
  );
}
