/**
 * Modes of shear buildings (lumped storey masses on massless, axially rigid columns).
 *
 * Closed form for the uniform N-storey building [1]:
 *   ω_j = 2√(k/m)·sin((2j−1)π / (2(2N+1))),  φ_j(i) = sin(i(2j−1)π / (2N+1)),  i = 1…N.
 * General storey masses and stiffnesses: the generalized symmetric eigenproblem
 * K φ = ω² M φ, solved as the standard symmetric problem M^{-1/2} K M^{-1/2} u = ω² u
 * (M is diagonal, so this is exact and keeps symmetry) with φ = M^{-1/2} u.
 *
 * [1] Chopra, Dynamics of Structures, MDOF chapters (uniform shear building; two-storey
 *     frame example with m₁ = 2m, m₂ = m, k₁ = 2k, k₂ = k).
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { assertInteger, assertNumberArray, assertPositive } from "@/lib/numeric/validate";
import { normaliseShape, type StructuralMode } from "./modes";

/**
 * Natural frequencies and shapes of a uniform N-storey shear building, closed form [1].
 *
 * @param n - number of storeys, integer in [1, 1000].
 * @param storeyStiffnessNPerM - lateral stiffness k of every storey in N/m, > 0.
 * @param storeyMassKg - mass m of every floor in kg, > 0.
 * @returns N modes in ascending frequency; `shape[i]` is floor i+1 (ground excluded, top
 *   last), normalised to max |φ| = 1 with the top floor positive.
 * @throws TypeError for non-numbers; RangeError for n outside [1, 1000] or non-positive k, m.
 */
export function shearFrameModes(n: number, storeyStiffnessNPerM: number, storeyMassKg: number): StructuralMode[] {
  assertInteger(n, "n", 1, 1000);
  assertPositive(storeyStiffnessNPerM, "storeyStiffnessNPerM");
  assertPositive(storeyMassKg, "storeyMassKg");
  const omega0 = Math.sqrt(storeyStiffnessNPerM / storeyMassKg);
  const modes: StructuralMode[] = [];
  for (let j = 1; j <= n; j++) {
    const omega = 2 * omega0 * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * n + 1)));
    const raw: number[] = [];
    for (let i = 1; i <= n; i++) raw.push(Math.sin((i * (2 * j - 1) * Math.PI) / (2 * n + 1)));
    modes.push({ frequencyHz: omega / (2 * Math.PI), shape: normaliseShape(raw) });
  }
  return modes;
}

/**
 * Modes of a shear building with arbitrary floor masses and storey stiffnesses.
 *
 * Method: K φ = ω² M φ with tridiagonal K (storey i joins floor i−1 and floor i; storey 1
 * joins floor 1 to the ground) and diagonal M [1], symmetrised by M^{-1/2} and solved by
 * ml-matrix's symmetric eigen decomposition (Householder + QL). Cost O(N³).
 *
 * @param massesKg - floor masses m₁…m_N in kg, bottom first, each > 0, N in [1, 500].
 * @param stiffnessesNPerM - storey stiffnesses k₁…k_N in N/m, bottom first, each > 0,
 *   same length as `massesKg`.
 * @returns N modes in ascending frequency (Hz), shapes normalised to max |φ| = 1, top positive.
 * @throws TypeError for non-arrays or non-finite entries; RangeError for unequal lengths,
 *   N > 500 or a non-positive mass or stiffness.
 */
export function modesOfShearModel(massesKg: ArrayLike<number>, stiffnessesNPerM: ArrayLike<number>): StructuralMode[] {
  assertNumberArray(massesKg, "massesKg");
  assertNumberArray(stiffnessesNPerM, "stiffnessesNPerM");
  const n = massesKg.length;
  if (stiffnessesNPerM.length !== n) {
    throw new RangeError(`stiffnessesNPerM must have the length of massesKg (got ${stiffnessesNPerM.length} ≠ ${n})`);
  }
  if (n > 500) throw new RangeError(`massesKg must have at most 500 floors (got ${n})`);
  for (let i = 0; i < n; i++) {
    if (!(massesKg[i] > 0)) throw new RangeError(`massesKg[${i}] must be > 0 (got ${massesKg[i]})`);
    if (!(stiffnessesNPerM[i] > 0)) {
      throw new RangeError(`stiffnessesNPerM[${i}] must be > 0 (got ${stiffnessesNPerM[i]})`);
    }
  }
  const invSqrtM = Array.from(massesKg, (m) => 1 / Math.sqrt(m));
  const a = Matrix.zeros(n, n);
  for (let i = 0; i < n; i++) {
    // K_ii = k_i + k_{i+1}; K_{i,i+1} = −k_{i+1}
    const kii = stiffnessesNPerM[i] + (i + 1 < n ? stiffnessesNPerM[i + 1] : 0);
    a.set(i, i, kii * invSqrtM[i] * invSqrtM[i]);
    if (i + 1 < n) {
      const off = -stiffnessesNPerM[i + 1] * invSqrtM[i] * invSqrtM[i + 1];
      a.set(i, i + 1, off);
      a.set(i + 1, i, off);
    }
  }
  const evd = new EigenvalueDecomposition(a, { assumeSymmetric: true });
  const lambdas = evd.realEigenvalues;
  const vecs = evd.eigenvectorMatrix;
  const order = lambdas.map((_, i) => i).sort((p, q) => lambdas[p] - lambdas[q]);
  return order.map((col) => {
    const phi = new Array<number>(n);
    for (let i = 0; i < n; i++) phi[i] = vecs.get(i, col) * invSqrtM[i];
    // K is positive definite, so λ > 0; clamp round-off of a nearly singular model.
    const omega = Math.sqrt(Math.max(lambdas[col], 0));
    return { frequencyHz: omega / (2 * Math.PI), shape: normaliseShape(phi) };
  });
}
