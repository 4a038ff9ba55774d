/**
 * Mode-shape normalisation: rotate a complex vector to be as real as possible, then scale.
 *
 * The rotation θ maximising Σ Re(φᵢ e^{−jθ})² is θ = ½·arg(Σ φᵢ²) (the principal axis of
 * the points φᵢ in the complex plane); the real part after rotation is the best real
 * approximation in the least-squares sense. Scaling: max |component| = 1, the largest
 * component positive [practice].
 */
import { assertComplexVector, type ComplexVector } from "@/lib/numeric/complex";

/**
 * Real, normalised mode shape from a complex singular vector.
 *
 * @param v - complex vector, length ≥ 1, finite, not all zero.
 * @returns real shape (dimensionless), max |value| = 1, the largest-magnitude value +1.
 * @throws TypeError for a malformed vector; RangeError for a zero vector.
 */
export function realiseShape(v: ComplexVector): Float64Array {
  assertComplexVector(v, "v");
  const n = v.re.length;
  let sr = 0, si = 0;
  for (let i = 0; i < n; i++) {
    sr += v.re[i] * v.re[i] - v.im[i] * v.im[i];
    si += 2 * v.re[i] * v.im[i];
  }
  const th = 0.5 * Math.atan2(si, sr);
  const c = Math.cos(th), s = Math.sin(th);
  const out = new Float64Array(n);
  let big = 0;
  let bigIdx = 0;
  for (let i = 0; i < n; i++) {
    // Re(φ e^{−jθ}) = re·cosθ + im·sinθ
    out[i] = v.re[i] * c + v.im[i] * s;
    if (Math.abs(out[i]) > big) {
      big = Math.abs(out[i]);
      bigIdx = i;
    }
  }
  if (big === 0) throw new RangeError("v must not be the zero vector (got ‖v‖ = 0)");
  const scale = (out[bigIdx] > 0 ? 1 : -1) / big;
  for (let i = 0; i < n; i++) out[i] *= scale;
  return out;
}
