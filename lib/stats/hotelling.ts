/**
 * Hotelling T² chart for individual observations (Phase I estimates, Phase II limit).
 *
 * Method [1, 2]: from m in-control training vectors x_1..x_m (p variables each), the mean
 * x̄ and the sample covariance S (divisor m − 1). A new vector x has
 *   T² = (x − x̄)ᵀ S⁻¹ (x − x̄)
 * and, for a future observation independent of the training set, the Phase II upper limit
 *   UCL = p(m + 1)(m − 1) / (m² − mp) · F_{1−α; p, m−p}
 * which tends to χ²_{1−α; p} for large m. S⁻¹ comes from a Cholesky factorisation
 * (ml-matrix), which also proves S positive definite.
 *
 * [1] Montgomery, Introduction to Statistical Quality Control, 7th ed., ch. 11.
 * [2] NIST/SEMATECH e-Handbook of Statistical Methods, §6.5.4.3.
 */
import { CholeskyDecomposition, Matrix } from "ml-matrix";
import { assertFiniteNumber, assertInteger, assertNumberArray } from "@/lib/numeric/validate";
import { fQuantile } from "./distributions";

/** Phase I estimates of a Hotelling T² chart. */
export interface HotellingModel {
  /** Number of variables p. */
  p: number;
  /** Number of training vectors m. */
  m: number;
  /** Training mean x̄, length p (units of the variables). */
  mean: Float64Array;
  /** Sample covariance S, p×p row-major (units²). */
  covariance: Float64Array;
  /** S⁻¹, p×p row-major (1/units²). */
  inverse: Float64Array;
}

/**
 * Phase II upper control limit of T² for individual observations (see header).
 *
 * @param p - number of variables, integer ≥ 1.
 * @param m - number of training vectors, integer > p.
 * @param alpha - false-alarm probability per point, in (0, 1); 0.0027 matches 3σ charts.
 * @returns UCL (dimensionless).
 * @throws TypeError for non-integers or a non-number alpha; RangeError for m ≤ p or alpha
 *   outside (0, 1).
 */
export function hotellingUcl(p: number, m: number, alpha: number): number {
  assertInteger(p, "p", 1);
  assertInteger(m, "m", 2);
  if (m <= p) throw new RangeError(`m must be > p (got m = ${m} ≤ p = ${p})`);
  assertFiniteNumber(alpha, "alpha");
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`alpha must be within (0, 1) (got ${alpha})`);
  const factor = (p * (m + 1) * (m - 1)) / (m * m - m * p);
  return factor * fQuantile(1 - alpha, p, m - p);
}

/**
 * Phase I: mean and covariance of m training vectors, and the inverse covariance.
 *
 * @param vectors - m rows of p finite values each (m > p, p ≥ 1); not mutated.
 * @returns the {@link HotellingModel}. Cost O(m p² + p³).
 * @throws TypeError for a non-array or non-finite entries; RangeError for ragged rows,
 *   m ≤ p, or a covariance that is not positive definite (constant or collinear variables).
 */
export function fitHotellingPhaseI(vectors: ReadonlyArray<ArrayLike<number>>): HotellingModel {
  if (!Array.isArray(vectors)) throw new TypeError(`vectors must be an array of rows (got ${typeof vectors})`);
  const m = vectors.length;
  if (m < 2) throw new RangeError(`vectors must hold at least 2 rows (got ${m})`);
  vectors.forEach((row, i) => assertNumberArray(row, `vectors[${i}]`));
  const p = vectors[0].length;
  for (let i = 1; i < m; i++) {
    if (vectors[i].length !== p) throw new RangeError(`every row must have p = ${p} values (got ${vectors[i].length} in row ${i})`);
  }
  if (m <= p) throw new RangeError(`m must be > p (got m = ${m} ≤ p = ${p})`);
  const mean = new Float64Array(p);
  for (const row of vectors) for (let j = 0; j < p; j++) mean[j] += row[j] / m;
  const cov = new Float64Array(p * p);
  for (const row of vectors) {
    for (let a = 0; a < p; a++) {
      const da = row[a] - mean[a];
      for (let b = a; b < p; b++) cov[a * p + b] += (da * (row[b] - mean[b])) / (m - 1);
    }
  }
  for (let a = 0; a < p; a++) for (let b = 0; b < a; b++) cov[a * p + b] = cov[b * p + a];
  const S = new Matrix(p, p);
  for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) S.set(a, b, cov[a * p + b]);
  const chol = new CholeskyDecomposition(S);
  if (!chol.isPositiveDefinite()) {
    throw new RangeError("the training covariance must be positive definite (got a singular one: constant or collinear variables)");
  }
  const inv = chol.solve(Matrix.eye(p));
  const inverse = new Float64Array(p * p);
  for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) inverse[a * p + b] = 0.5 * (inv.get(a, b) + inv.get(b, a));
  return { p, m, mean, covariance: cov, inverse };
}

/**
 * T² of one vector against a Phase I model.
 *
 * @param model - from {@link fitHotellingPhaseI}.
 * @param x - p finite values (same variables and units as the training vectors).
 * @returns T² ≥ 0 (dimensionless).
 * @throws TypeError for non-finite entries; RangeError when x.length ≠ p.
 */
export function hotellingT2(model: HotellingModel, x: ArrayLike<number>): number {
  assertNumberArray(x, "x");
  const p = model.p;
  if (x.length !== p) throw new RangeError(`x must have p = ${p} values (got ${x.length})`);
  let t2 = 0;
  for (let a = 0; a < p; a++) {
    const da = x[a] - model.mean[a];
    for (let b = 0; b < p; b++) t2 += da * model.inverse[a * p + b] * (x[b] - model.mean[b]);
  }
  return Math.max(0, t2);
}

/**
 * Smallest shift of one variable alone that the T² chart detects "at its limit":
 * δ_j = √(UCL / (S⁻¹)_jj), the shift whose non-centrality δ²(S⁻¹)_jj equals the UCL (a
 * shift this size gives a mean T² ≈ UCL + p, i.e. it is signalled more often than not
 * within a few points [1]). Definition of ours, stated so that it can be shown.
 *
 * @param model - from {@link fitHotellingPhaseI}.
 * @param ucl - the T² limit in use, > 0.
 * @returns δ_j per variable, length p (units of the variables).
 * @throws TypeError / RangeError when ucl is not a positive finite number.
 */
export function hotellingMinimalShift(model: HotellingModel, ucl: number): Float64Array {
  assertFiniteNumber(ucl, "ucl");
  if (!(ucl > 0)) throw new RangeError(`ucl must be > 0 (got ${ucl})`);
  const out = new Float64Array(model.p);
  for (let j = 0; j < model.p; j++) out[j] = Math.sqrt(ucl / model.inverse[j * model.p + j]);
  return out;
}
