/**
 * Exact discretisation of a damped single-degree-of-freedom oscillator (one mode in modal
 * coordinates) driven by a force that varies linearly between samples (first-order hold).
 *
 * Continuous model, per unit modal mass: q̈ + 2ζω q̇ + ω² q = u(t), state x = [q, q̇],
 * ẋ = A x + B u with A = [[0, 1], [−ω², −2ζω]], B = [0, 1]ᵀ. With u linear on each step h,
 *   x_{k+1} = Φ x_k + (Γ − Λ) u_k + Λ u_{k+1},
 *   Φ = e^{Ah},  Γ = ∫₀ʰ e^{Aσ}dσ B,  Λ = (1/h)∫₀ʰ e^{A(h−s)} s ds B,
 * read off one exponential of the augmented matrix [[A, B, 0], [0, 0, 1/h], [0, 0, 0]]·h
 * [1, §4.3]. The recursion is then exact for that input: no integration error, whatever ωh.
 * First-order hold (rather than zero-order hold) gives the sampled force and response a
 * common time base, so the discrete FRF has no spurious half-sample delay (phase error
 * π f/fs under zero-order hold).
 *
 * [1] Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed., ch. 4 & 6.
 */
import { expmSmall } from "./expm-small";

/** Coefficients of the exact first-order-hold recursion of one mode (internal type). */
export interface SdofRecursion {
  /** Φ row-major [φ11, φ12, φ21, φ22]. */
  phi: Float64Array;
  /** Γ − Λ (weight of u_k), [position, velocity]. */
  g0: Float64Array;
  /** Λ (weight of u_{k+1}), [position, velocity]. */
  g1: Float64Array;
}

/**
 * Builds the exact recursion for natural frequency ω (rad/s), damping ratio ζ and step h (s).
 * Internal helper: trusts its caller (ω > 0, 0 < ζ < 1, h > 0).
 */
export function sdofRecursion(omega: number, zeta: number, h: number): SdofRecursion {
  const m = new Float64Array(16);
  // Row-major 4×4: [q, q̇, u, Δu/h] with time already multiplied in.
  m[0 * 4 + 1] = h;
  m[1 * 4 + 0] = -omega * omega * h;
  m[1 * 4 + 1] = -2 * zeta * omega * h;
  m[1 * 4 + 2] = h;
  m[2 * 4 + 3] = 1; // (1/h)·h
  const e = expmSmall(m, 4);
  const gamma = [e[0 * 4 + 2], e[1 * 4 + 2]];
  const lambda = [e[0 * 4 + 3], e[1 * 4 + 3]];
  return {
    phi: Float64Array.of(e[0], e[1], e[4], e[5]),
    g0: Float64Array.of(gamma[0] - lambda[0], gamma[1] - lambda[1]),
    g1: Float64Array.of(lambda[0], lambda[1]),
  };
}

/** Modal response histories written by {@link runSdof}. */
export interface SdofHistory {
  displacement: Float64Array;
  velocity: Float64Array;
  acceleration: Float64Array;
}

/**
 * Runs the recursion over the force samples `u` (length n + 1, the last one only shapes the
 * final step) from state (q0, v0). Acceleration is q̈_k = u_k − 2ζω q̇_k − ω² q_k, exact at
 * the sample instants. Internal helper.
 */
export function runSdof(
  rec: SdofRecursion,
  omega: number,
  zeta: number,
  u: Float64Array,
  n: number,
  q0: number,
  v0: number,
  keepStates: boolean,
): SdofHistory {
  const [p11, p12, p21, p22] = rec.phi;
  const [a0, b0] = rec.g0;
  const [a1, b1] = rec.g1;
  const w2 = omega * omega;
  const c = 2 * zeta * omega;
  const acc = new Float64Array(n);
  const dis = keepStates ? new Float64Array(n) : new Float64Array(0);
  const vel = keepStates ? new Float64Array(n) : new Float64Array(0);
  let q = q0;
  let v = v0;
  for (let k = 0; k < n; k++) {
    const uk = u[k];
    acc[k] = uk - c * v - w2 * q;
    if (keepStates) {
      dis[k] = q;
      vel[k] = v;
    }
    const uk1 = u[k + 1];
    const qn = p11 * q + p12 * v + a0 * uk + a1 * uk1;
    v = p21 * q + p22 * v + b0 * uk + b1 * uk1;
    q = qn;
  }
  return { displacement: dis, velocity: vel, acceleration: acc };
}
