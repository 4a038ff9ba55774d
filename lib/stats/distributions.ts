/**
 * Normal, χ² and F distribution functions and quantiles for control-chart limits.
 *
 * Method: the cdfs are the regularized incomplete gamma and beta functions [1] from jStat
 * (npm `jstat` 1.9.6, continued fractions and series, ~1e-9 relative or better):
 *   χ²_k:  F(x) = P(k/2, x/2)
 *   F_{d1,d2}: F(x) = I_{d1x/(d1x+d2)}(d1/2, d2/2), upper tail I_{d2/(d2+d1x)}(d2/2, d1/2)
 *   normal: Φ(x) = ½·(1 + erf(x/√2)).
 * Quantiles invert the cdf (or, for p > ½, the upper tail, which keeps the relative
 * precision of small tail areas) by bracketing and bisection to ~1e-13 relative [2]; the
 * normal quantile starts from Abramowitz & Stegun 26.2.23 (|ε| < 4.5e-4) [1] and refines
 * it by Newton steps on Φ. Checked against scipy.stats (REFERENCES.md, tests/unit/stats).
 *
 * [1] Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, §6.5, §26.2, §26.4, §26.6.
 * [2] Press et al., Numerical Recipes, 3rd ed., 2007, §6.4 and §9.1 (bracketing, bisection).
 */
import jStat from "jstat";
import { assertFiniteNumber, assertPositive } from "@/lib/numeric/validate";

const SQRT2 = Math.SQRT2;
const SQRT2PI = Math.sqrt(2 * Math.PI);

function assertProbability(p: unknown, name: string): asserts p is number {
  assertFiniteNumber(p, name);
  if (!(p > 0 && p < 1)) throw new RangeError(`${name} must be within (0, 1) (got ${p})`);
}

/**
 * Standard normal cdf Φ(x).
 *
 * @param x - abscissa, any finite number (dimensionless).
 * @returns Φ(x) in [0, 1]; absolute error ~1e-16 (relative error grows in the far lower tail).
 * @throws TypeError when `x` is not a finite number.
 */
export function normalCdf(x: number): number {
  assertFiniteNumber(x, "x");
  return 0.5 * (1 + jStat.erf(x / SQRT2));
}

/**
 * Standard normal quantile Φ⁻¹(p) (A&S 26.2.23 start, Newton refinement; see header).
 *
 * @param p - probability in (0, 1); for p < 1e-12 or p > 1 − 1e-12 accuracy falls to ~1e-6.
 * @returns z with Φ(z) = p (dimensionless).
 * @throws TypeError for a non-number; RangeError for p outside (0, 1).
 */
export function normalQuantile(p: number): number {
  assertProbability(p, "p");
  const q = p < 0.5 ? p : 1 - p;
  const t = Math.sqrt(-2 * Math.log(q));
  let z = t - (2.515517 + 0.802853 * t + 0.010328 * t * t) / (1 + 1.432788 * t + 0.189269 * t * t + 0.001308 * t * t * t);
  if (p < 0.5) z = -z;
  for (let k = 0; k < 4; k++) {
    const dens = Math.exp(-0.5 * z * z) / SQRT2PI;
    // Work on the tail that holds p so the residual keeps its relative precision.
    const resid = p < 0.5 ? 0.5 * (1 + jStat.erf(z / SQRT2)) - p : (1 - p) - 0.5 * (1 - jStat.erf(z / SQRT2));
    const step = resid / dens;
    z -= step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(z))) break;
  }
  return z;
}

/**
 * χ² cdf with `df` degrees of freedom.
 *
 * @param x - value ≥ 0 (x < 0 gives 0).
 * @param df - degrees of freedom, > 0 (need not be an integer).
 * @returns P(X ≤ x) in [0, 1].
 * @throws TypeError for non-numbers; RangeError for df ≤ 0.
 */
export function chiSquareCdf(x: number, df: number): number {
  assertFiniteNumber(x, "x");
  assertPositive(df, "df");
  return x <= 0 ? 0 : jStat.lowRegGamma(df / 2, x / 2);
}

/**
 * χ² quantile: x with P(X ≤ x) = p.
 *
 * @param p - probability in (0, 1).
 * @param df - degrees of freedom, > 0.
 * @returns quantile ≥ 0, relative accuracy ~1e-9 (limited by the incomplete gamma).
 * @throws TypeError for non-numbers; RangeError for p outside (0, 1) or df ≤ 0.
 */
export function chiSquareQuantile(p: number, df: number): number {
  assertProbability(p, "p");
  assertPositive(df, "df");
  const lower = (x: number) => jStat.lowRegGamma(df / 2, x / 2);
  return invertMonotone(p, lower, (x) => 1 - lower(x), df);
}

/**
 * F distribution cdf with (d1, d2) degrees of freedom.
 *
 * @param x - value ≥ 0 (x < 0 gives 0).
 * @param d1 - numerator degrees of freedom, > 0.
 * @param d2 - denominator degrees of freedom, > 0.
 * @returns P(X ≤ x) in [0, 1].
 * @throws TypeError for non-numbers; RangeError for d1 or d2 ≤ 0.
 */
export function fCdf(x: number, d1: number, d2: number): number {
  assertFiniteNumber(x, "x");
  assertPositive(d1, "d1");
  assertPositive(d2, "d2");
  return x <= 0 ? 0 : jStat.ibeta((d1 * x) / (d1 * x + d2), d1 / 2, d2 / 2);
}

/**
 * F quantile: x with P(X ≤ x) = p.
 *
 * @param p - probability in (0, 1).
 * @param d1 - numerator degrees of freedom, > 0.
 * @param d2 - denominator degrees of freedom, > 0.
 * @returns quantile ≥ 0, relative accuracy ~1e-8 (limited by the incomplete beta).
 * @throws TypeError for non-numbers; RangeError for p outside (0, 1) or d1, d2 ≤ 0.
 */
export function fQuantile(p: number, d1: number, d2: number): number {
  assertProbability(p, "p");
  assertPositive(d1, "d1");
  assertPositive(d2, "d2");
  const lower = (x: number) => jStat.ibeta((d1 * x) / (d1 * x + d2), d1 / 2, d2 / 2);
  const upper = (x: number) => jStat.ibeta(d2 / (d2 + d1 * x), d2 / 2, d1 / 2);
  return invertMonotone(p, lower, upper, 1);
}

/**
 * Solves cdf(x) = p on x > 0 for an increasing cdf: for p > ½ solves upper(x) = 1 − p.
 * Brackets by doubling/halving from `guess`, then bisects (in log x while the bracket spans
 * decades) until the bracket is below 1e-13 relative.
 */
function invertMonotone(p: number, lower: (x: number) => number, upper: (x: number) => number, guess: number): number {
  const useUpper = p > 0.5;
  const target = useUpper ? 1 - p : p;
  // g(x) < 0 left of the root, > 0 right of it.
  const g = useUpper ? (x: number) => target - upper(x) : (x: number) => lower(x) - target;
  let lo = guess;
  let hi = guess;
  while (g(lo) > 0 && lo > 1e-300) lo /= 2;
  while (g(hi) < 0 && hi < 1e300) hi *= 2;
  for (let it = 0; it < 400 && hi - lo > 1e-13 * hi; it++) {
    const mid = hi / lo > 4 && lo > 0 ? Math.sqrt(lo * hi) : 0.5 * (lo + hi);
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}
