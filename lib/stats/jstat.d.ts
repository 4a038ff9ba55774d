/**
 * Type declarations for the parts of jStat 1.9.6 (npm `jstat`, no bundled types) that the
 * statistics library uses: the regularized incomplete beta and gamma functions and erf.
 */
declare module "jstat" {
  interface JStatSpecialFunctions {
    /** Regularized incomplete beta I_x(a, b), x in [0, 1], a, b > 0. */
    ibeta(x: number, a: number, b: number): number;
    /** Regularized lower incomplete gamma P(a, x), a > 0, x ≥ 0. */
    lowRegGamma(a: number, x: number): number;
    /** Error function erf(x). */
    erf(x: number): number;
  }
  const jStat: JStatSpecialFunctions;
  export default jStat;
}
