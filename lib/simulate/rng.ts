/**
 * Seeded pseudo-random numbers for simulations and tests.
 *
 * Uniforms come from xoshiro128** [1] (32-bit state words, so it runs on plain JS numbers
 * without BigInt), seeded through splitmix32 so that nearby seeds give unrelated streams.
 * Normal deviates use Marsaglia's polar method [2], which needs no trigonometry and keeps
 * the second deviate of each pair for the next call.
 *
 * [1] Blackman & Vigna, "Scrambled linear pseudorandom number generators", ACM TOMS 47(4), 2021.
 * [2] Marsaglia & Bray, "A convenient method for generating normal variables", SIAM Rev. 6(3), 1964.
 */
import { assertFiniteNumber } from "@/lib/numeric/validate";

/** A seeded generator: the same seed always yields the same sequence. */
export interface Rng {
  /** A uniform deviate in [0, 1) with 32 random bits. */
  next(): number;
  /** A standard normal deviate (mean 0, variance 1). */
  normal(): number;
}

/** splitmix32 step: spreads one 32-bit word into a well-mixed one (state expansion). */
function splitmix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * Creates a seeded xoshiro128** generator with a polar-method normal sampler.
 *
 * Method: xoshiro128** [1] seeded by splitmix32; normals by the polar method [2].
 *
 * @param seed - any finite number; non-integers and values beyond 32 bits are folded into
 *   a 32-bit word (integer part and fractional bits both count), so every distinct small
 *   integer seed gives a distinct stream.
 * @returns a generator object {@link Rng}; its state is private to it.
 * @throws TypeError when `seed` is not a finite number.
 */
export function createRng(seed: number): Rng {
  assertFiniteNumber(seed, "seed");
  // Fold the seed into 32 bits: low word, high word and fractional part all contribute.
  const hi = Math.floor(seed / 4294967296);
  const frac = Math.floor((seed - Math.floor(seed)) * 4294967296);
  const st = { s: (seed | 0) ^ Math.imul(hi | 0, 0x27d4eb2d) ^ Math.imul(frac | 0, 0x165667b1) };
  let s0 = splitmix32(st);
  let s1 = splitmix32(st);
  let s2 = splitmix32(st);
  let s3 = splitmix32(st);
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1; // the all-zero state is a fixed point

  function nextU32(): number {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  }

  let spare = 0;
  let hasSpare = false;
  return {
    next: () => nextU32() / 4294967296,
    normal(): number {
      if (hasSpare) {
        hasSpare = false;
        return spare;
      }
      let u: number, v: number, s: number;
      do {
        u = (nextU32() / 4294967296) * 2 - 1;
        v = (nextU32() / 4294967296) * 2 - 1;
        s = u * u + v * v;
      } while (s >= 1 || s === 0);
      const m = Math.sqrt((-2 * Math.log(s)) / s);
      spare = v * m;
      hasSpare = true;
      return u * m;
    },
  };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
