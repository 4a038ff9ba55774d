/**
 * Thin, typed wrapper over fft.js (radix-4, power-of-two sizes). Plans are cached per size
 * because building the twiddle table costs about as much as a transform.
 *
 * Convention (same as NumPy/SciPy): X_k = Σ_n x_n e^{−2πjkn/N}; the inverse carries 1/N.
 */
import FFT from "fft.js";
import { assertInteger } from "./validate";

const plans = new Map<number, FFT>();

/** True when n is a power of two ≥ 2. */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 2 && (n & (n - 1)) === 0;
}

/** Smallest power of two ≥ n (n ≥ 1). */
export function nextPowerOfTwo(n: number): number {
  let p = 2;
  while (p < n) p *= 2;
  return p;
}

/**
 * A reusable real-input FFT of a fixed power-of-two size.
 *
 * @param size - transform length N, a power of two ≥ 4 (fft.js' radix-4 kernel needs ≥ 4).
 * @throws TypeError / RangeError when `size` is not such a power of two.
 */
export function getRealFft(size: number): RealFft {
  assertInteger(size, "size", 4);
  if (!isPowerOfTwo(size)) throw new RangeError(`size must be a power of two (got ${size})`);
  let plan = plans.get(size);
  if (!plan) {
    plan = new FFT(size);
    plans.set(size, plan);
  }
  return new RealFft(plan, size);
}

/** Real FFT of one fixed size; owns its scratch buffers (not shared between threads). */
export class RealFft {
  /** Interleaved complex output scratch, length 2N. */
  private readonly out: Float64Array;
  private readonly cin: Float64Array;

  constructor(
    private readonly plan: FFT,
    readonly size: number,
  ) {
    this.out = new Float64Array(2 * size);
    this.cin = new Float64Array(2 * size);
  }

  /**
   * Forward transform of a real frame; writes lines 0…N/2 into `re`/`im` (length ≥ N/2+1)
   * starting at `offset`. Internal fast path: the caller guarantees sizes.
   */
  forwardHalf(frame: Float64Array, re: Float64Array, im: Float64Array, offset = 0): void {
    const out = this.out;
    this.plan.realTransform(out, frame);
    const half = this.size >> 1;
    for (let k = 0; k <= half; k++) {
      re[offset + k] = out[2 * k];
      im[offset + k] = out[2 * k + 1];
    }
  }

  /**
   * Forward transform of a real frame writing line k to `re/im[offset + k·stride]`
   * (a transposed layout without a separate transposition pass). Internal fast path.
   */
  forwardHalfStrided(frame: Float64Array, re: Float64Array, im: Float64Array, offset: number, stride: number): void {
    const out = this.out;
    this.plan.realTransform(out, frame);
    const half = this.size >> 1;
    for (let k = 0, o = offset; k <= half; k++, o += stride) {
      re[o] = out[2 * k];
      im[o] = out[2 * k + 1];
    }
  }

  /**
   * Forward transforms of two real frames with one complex FFT (z = a + j·b, then
   * A_k = (Z_k + conj Z_{N−k})/2, B_k = (Z_k − conj Z_{N−k})/(2j)), about 30 % cheaper than
   * two real transforms with fft.js. Writes line k of A at `reA/imA[offA + k·stride]`, of B
   * at offB likewise. Internal fast path.
   */
  forwardPairStrided(a: Float64Array, b: Float64Array, re: Float64Array, im: Float64Array, offA: number, offB: number, stride: number): void {
    const n = this.size;
    const cin = this.cin;
    const out = this.out;
    for (let t = 0; t < n; t++) {
      cin[2 * t] = a[t];
      cin[2 * t + 1] = b[t];
    }
    this.plan.transform(out, cin);
    const half = n >> 1;
    for (let k = 0, oa = offA, ob = offB; k <= half; k++, oa += stride, ob += stride) {
      const m = k === 0 ? 0 : n - k;
      const zr = out[2 * k], zi = out[2 * k + 1], mr = out[2 * m], mi = out[2 * m + 1];
      re[oa] = 0.5 * (zr + mr);
      im[oa] = 0.5 * (zi - mi);
      re[ob] = 0.5 * (zi + mi);
      im[ob] = -0.5 * (zr - mr);
    }
  }

  /**
   * Inverse transform of a Hermitian spectrum given by its lines 0…N/2 (the rest is the
   * conjugate mirror), returning the real sequence of length N (with the 1/N factor).
   */
  inverseHalf(re: ArrayLike<number>, im: ArrayLike<number>, target: Float64Array): void {
    const n = this.size;
    const half = n >> 1;
    const cin = this.cin;
    for (let k = 0; k <= half; k++) {
      cin[2 * k] = re[k];
      cin[2 * k + 1] = im[k];
    }
    for (let k = half + 1; k < n; k++) {
      cin[2 * k] = re[n - k];
      cin[2 * k + 1] = -im[n - k];
    }
    this.plan.inverseTransform(this.out, cin);
    // fft.js' inverseTransform already divides by N.
    for (let i = 0; i < n; i++) target[i] = this.out[2 * i];
  }
}
