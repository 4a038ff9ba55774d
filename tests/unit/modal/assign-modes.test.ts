import { describe, expect, it } from "vitest";
import { assignModes, solveAssignment, type AssignCandidate, type AssignTarget } from "@/lib/modal/assign-modes";
import { createRng } from "@/lib/simulate/rng";
import { shearFrameModes } from "@/lib/simulate/shear-frame";

const real = (x: number[]) => ({ re: Float64Array.from(x), im: new Float64Array(x.length) });
const target = (f0: number, lo: number, hi: number, ref: number[] | null): AssignTarget => ({
  nominalFrequencyHz: f0, bandLowHz: lo, bandHighHz: hi, referenceShape: ref,
});
const cand = (f: number, shape: number[]): AssignCandidate => ({ frequencyHz: f, shape: real(shape) });

/** Exhaustive oracle: every injective map rows → columns (or none), minimising cost, as the definition of the problem. */
function bruteForce(cost: number[][], n: number, m: number): number {
  let best = Infinity;
  const used = new Array<boolean>(m).fill(false);
  const walk = (r: number, acc: number) => {
    if (acc >= best) return;
    if (r === n) {
      best = acc;
      return;
    }
    if (n - r > m - used.filter(Boolean).length) {
      // more rows than free columns: this row may take a zero-cost dummy
      walk(r + 1, acc);
    }
    for (let c = 0; c < m; c++) {
      if (used[c]) continue;
      used[c] = true;
      walk(r + 1, acc + cost[r][c]);
      used[c] = false;
    }
  };
  walk(0, 0);
  return best;
}

describe("solveAssignment", () => {
  it("reaches the exhaustive-enumeration optimum on random square and rectangular matrices", () => {
    // Identity check: the Hungarian method is exact [Kuhn 1955; Munkres 1957], so its total
    // cost equals the minimum over all assignments enumerated by brute force.
    const rng = createRng(20260201);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(rng.next() * 5);
      const m = 1 + Math.floor(rng.next() * 6);
      const cost = Array.from({ length: n }, () => Array.from({ length: m }, () => Math.round(rng.next() * 1000) / 100));
      const match = solveAssignment(cost, n, m);
      const cols = match.filter((c) => c >= 0);
      expect(new Set(cols).size).toBe(cols.length);
      expect(cols.length).toBe(Math.min(n, m));
      const total = match.reduce((s, c, r) => s + (c >= 0 ? cost[r][c] : 0), 0);
      expect(total).toBeCloseTo(bruteForce(cost, n, m), 9);
    }
  });
});

describe("assignModes", () => {
  // Uniform 4-storey shear frame, closed form [pub: Chopra, Dynamics of Structures, MDOF
  // chapters]; its modes are mass-orthogonal with M = mI, so the MAC between two different
  // modes is 0 and a mode with itself 1 [pub: Allemang & Brown 1982].
  const frame = shearFrameModes(4, 4.0e6, 1.0e4);
  const targets = frame.map((m) => target(m.frequencyHz * 1.02, m.frequencyHz * 0.9, m.frequencyHz * 1.12, m.shape));

  it("recovers each shear-frame mode from a shuffled list with estimation noise", () => {
    const order = [2, 0, 3, 1];
    const candidates = order.map((k) => cand(frame[k].frequencyHz * (1 + 0.003 * (k - 1.5)), frame[k].shape.map((v, i) => v + 0.01 * ((i % 2) - 0.5))));
    const r = assignModes(targets, candidates);
    r.assignments.forEach((a, j) => {
      expect(a.mode).toBe(order.indexOf(j));
      expect(a.mac).toBeGreaterThan(0.99);
      expect(a.frequencyDeviation).toBeCloseTo((candidates[a.mode!].frequencyHz - targets[j].nominalFrequencyHz) / targets[j].nominalFrequencyHz, 12);
    });
    expect(r.unassigned).toEqual([]);
  });

  it("decides between two modes inside both bands by shape (MAC gate 0.8 [practice])", () => {
    const phi1 = frame[0].shape;
    const phi2 = frame[1].shape;
    const t = [target(2.0, 1.8, 2.25, phi1), target(2.05, 1.8, 2.25, phi2)];
    // The candidate nearer to mode A's nominal frequency has mode B's shape.
    const r = assignModes(t, [cand(2.04, phi1), cand(2.01, phi2)]);
    expect(r.assignments.map((a) => a.mode)).toEqual([0, 1]);
  });

  it("leaves a tracked mode not identified when the only candidate fails the MAC gate", () => {
    // MAC([1,0],[0,1]) = 0 [pub: REFERENCES.md test vector].
    const r = assignModes([target(3, 2.5, 3.5, [1, 0])], [cand(3, [0, 1])]);
    expect(r.assignments[0]).toEqual({ mode: null, mac: null, frequencyDeviation: null, cost: null });
    expect(r.unassigned).toEqual([0]);
  });

  it("accepts a shape with MAC 0.99206 to its reference (REFERENCES.md vector) and reports that MAC", () => {
    const r = assignModes([target(3, 2.5, 3.5, [1, 2, 3])], [cand(3.1, [1, 2, 2.5])]);
    expect(r.assignments[0].mode).toBe(0);
    expect(r.assignments[0].mac).toBeCloseTo(0.99206, 5);
    // cost = |3.1 − 3|/(3.5 − 2.5) + (1 − MAC), the documented definition.
    expect(r.assignments[0].cost).toBeCloseTo(0.1 + (1 - 0.992063), 5);
  });

  it("never assigns a candidate outside the band, however close its shape", () => {
    const r = assignModes([target(3, 2.9, 3.1, [1, 2])], [cand(3.11, [1, 2]), cand(2.89, [1, 2])]);
    expect(r.assignments[0].mode).toBeNull();
    expect(r.unassigned).toEqual([0, 1]);
  });

  it("gives one candidate to one tracked mode only: the cheaper pair wins", () => {
    const r = assignModes([target(2.0, 1.5, 2.5, null), target(2.3, 1.8, 2.8, null)], [cand(2.02, [1, 1])]);
    expect(r.assignments[0].mode).toBe(0);
    expect(r.assignments[1].mode).toBeNull();
    expect(r.assignments[0].mac).toBeNull();
  });

  it("prefers assigning more tracked modes over a cheaper partial assignment", () => {
    // A alone on x costs 0; A–y plus B–x costs 0.25 + 0.33 but identifies both modes.
    const r = assignModes([target(2.0, 1.0, 3.0, null), target(2.2, 1.9, 2.5, null)], [cand(2.0, [1, 0]), cand(1.5, [0, 1])]);
    expect(r.assignments.map((a) => a.mode)).toEqual([1, 0]);
  });

  it("computes the MAC over the channels a partial reference covers (NaN = not covered)", () => {
    const r = assignModes([target(3, 2, 4, [1, 2, Number.NaN])], [cand(3, [2, 4, -7])]);
    expect(r.assignments[0].mac).toBeCloseTo(1, 12);
    const single = assignModes([target(3, 2, 4, [1, Number.NaN, Number.NaN])], [cand(3.2, [0, 1, 0])]);
    // One covered channel: no MAC, the pair is judged on frequency alone.
    expect(single.assignments[0].mode).toBe(0);
    expect(single.assignments[0].mac).toBeNull();
  });

  it("handles no tracked modes and no candidates", () => {
    expect(assignModes([], [cand(1, [1])])).toEqual({ assignments: [], unassigned: [0] });
    expect(assignModes([target(1, 0.5, 1.5, null)], []).assignments[0].mode).toBeNull();
  });

  it("refuses a band with low ≥ high, a nominal outside its band and mismatched shape lengths", () => {
    expect(() => assignModes([target(1, 2, 1, null)], [])).toThrow(RangeError);
    expect(() => assignModes([target(3, 1, 2, null)], [])).toThrow(RangeError);
    expect(() => assignModes([target(1.5, 1, 2, [1, 2, 3])], [cand(1.5, [1, 2])])).toThrow(RangeError);
    expect(() => assignModes([], [cand(1, [1, 2]), cand(2, [1])])).toThrow(RangeError);
    expect(() => assignModes([], [cand(Number.NaN, [1])])).toThrow(TypeError);
  });
});
