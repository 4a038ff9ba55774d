/**
 * Modal Assurance Criterion and Modal Phase Collinearity.
 *
 * MAC(a, b) = |aᴴb|² / ((aᴴa)(bᴴb)) [1]: 1 for collinear shapes, 0 for orthogonal ones.
 * MPC(φ) = |Σφᵢ²|² / (Σ|φᵢ|²)² [2]: 1 for a mode whose components are all in phase or in
 * anti-phase (a "real" mode, up to one global rotation), lower for complex modes.
 *
 * [1] Allemang & Brown, Proc. IMAC I, 1982.
 * [2] Pappa, Elliott & Schenk, J. Guid. Control Dyn. 16(5), 1993 (closed form used here).
 */
import { assertComplexVector, type ComplexVector } from "@/lib/numeric/complex";
import { assertNumberArray } from "@/lib/numeric/validate";

/**
 * MAC between two complex vectors.
 *
 * @param a - complex vector, length n ≥ 1, finite; not all zero.
 * @param b - complex vector, same length as `a`, finite; not all zero.
 * @returns MAC in [0, 1] (dimensionless).
 * @throws TypeError for a non-vector or non-finite entries; RangeError for unequal lengths
 *   or a zero vector (MAC undefined).
 */
export function mac(a: ComplexVector, b: ComplexVector): number {
  assertComplexVector(a, "a");
  assertComplexVector(b, "b");
  const n = a.re.length;
  if (b.re.length !== n) throw new RangeError(`a and b must have equal length (got ${n} ≠ ${b.re.length})`);
  let cr = 0;
  let ci = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < n; i++) {
    const ar = a.re[i], ai = a.im[i], br = b.re[i], bi = b.im[i];
    // aᴴb = Σ conj(a_i) b_i
    cr += ar * br + ai * bi;
    ci += ar * bi - ai * br;
    aa += ar * ar + ai * ai;
    bb += br * br + bi * bi;
  }
  if (aa === 0) throw new RangeError("a must not be the zero vector (MAC undefined; got ‖a‖ = 0)");
  if (bb === 0) throw new RangeError("b must not be the zero vector (MAC undefined; got ‖b‖ = 0)");
  return Math.min(1, (cr * cr + ci * ci) / (aa * bb));
}

/**
 * MAC between two real vectors (same formula with zero imaginary parts).
 *
 * @param a - real vector, length n ≥ 1, finite, not all zero.
 * @param b - real vector, same length, finite, not all zero.
 * @returns MAC in [0, 1].
 * @throws TypeError / RangeError as {@link mac}.
 */
export function macReal(a: ArrayLike<number>, b: ArrayLike<number>): number {
  assertNumberArray(a, "a");
  assertNumberArray(b, "b");
  const n = a.length;
  if (b.length !== n) throw new RangeError(`a and b must have equal length (got ${n} ≠ ${b.length})`);
  let c = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < n; i++) {
    c += a[i] * b[i];
    aa += a[i] * a[i];
    bb += b[i] * b[i];
  }
  if (aa === 0) throw new RangeError("a must not be the zero vector (MAC undefined; got ‖a‖ = 0)");
  if (bb === 0) throw new RangeError("b must not be the zero vector (MAC undefined; got ‖b‖ = 0)");
  return Math.min(1, (c * c) / (aa * bb));
}

/**
 * Modal Phase Collinearity of a complex mode shape.
 *
 * @param v - complex vector, length n ≥ 1, finite, not all zero.
 * @returns MPC in [0, 1]; 1 for a real vector times any e^{jθ}.
 * @throws TypeError for a non-vector or non-finite entries; RangeError for a zero vector.
 */
export function mpc(v: ComplexVector): number {
  assertComplexVector(v, "v");
  let sr = 0; // Re Σ φ²
  let si = 0; // Im Σ φ²
  let nn = 0; // Σ |φ|²
  for (let i = 0; i < v.re.length; i++) {
    const r = v.re[i], m = v.im[i];
    sr += r * r - m * m;
    si += 2 * r * m;
    nn += r * r + m * m;
  }
  if (nn === 0) throw new RangeError("v must not be the zero vector (MPC undefined; got ‖v‖ = 0)");
  return Math.min(1, (sr * sr + si * si) / (nn * nn));
}
