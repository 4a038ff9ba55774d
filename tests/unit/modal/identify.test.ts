/**
 * Identification of simulated records (lib/simulate, exact modal superposition) whose modes
 * come from closed forms of REFERENCES.md.
 */
import { describe, expect, it } from "vitest";
import { identifyModes, type IdentifiedMode } from "@/lib/modal/identify";
import { macReal } from "@/lib/modal/mac";
import { simulateAmbientRecord } from "@/lib/simulate";

// Uniform N-storey shear building [pub: Chopra, MDOF chapters; REFERENCES.md]:
// ω_j = 2√(k/m)·sin((2j−1)π/(2(2N+1))), φ_j(i) = sin(i(2j−1)π/(2N+1)), floors i = 1…N.
const N = 3;
const K_OVER_M = 448.5; // (N/m)/kg: f₁ = 1.500 Hz
const frame = [1, 2, 3].map((j) => ({
  frequencyHz: (2 * Math.sqrt(K_OVER_M) * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * N + 1)))) / (2 * Math.PI),
  dampingRatio: 0.01,
  shape: [1, 2, 3].map((i) => Math.sin((i * (2 * j - 1) * Math.PI) / (2 * N + 1))),
}));
const FS = 20;
const CH = ["F1", "F2", "F3"];

function nearest(modes: IdentifiedMode[], f: number): IdentifiedMode | undefined {
  return modes.reduce<IdentifiedMode | undefined>((a, m) => (!a || Math.abs(m.frequencyHz - f) < Math.abs(a.frequencyHz - f) ? m : a), undefined);
}
function median(x: number[]): number {
  const a = [...x].sort((p, q) => p - q);
  return a.length % 2 ? a[(a.length - 1) / 2] : 0.5 * (a[a.length / 2 - 1] + a[a.length / 2]);
}

describe("identifyModes on a simulated 3-storey shear frame", () => {
  it("matches the closed-form coefficients of REFERENCES.md (0.445042, 1.246980, 1.801938)", () => {
    const w = Math.sqrt(K_OVER_M);
    [0.445042, 1.24698, 1.801938].forEach((c, j) => expect((2 * Math.PI * frame[j].frequencyHz) / w).toBeCloseTo(c, 6));
  });

  const seeds = [1, 2, 3, 4, 5];
  const runs = seeds.map((seed) => {
    const sim = simulateAmbientRecord({ modes: frame, sampleRateHz: FS, durationS: 3600, seed });
    return identifyModes({ sampleRateHz: FS, channels: CH, data: sim.data }, { nperseg: 2048 });
  });

  it("finds each mode within 0.3 % of its frequency, MAC ≥ 0.99 and MPC ≥ 0.99, in every record", () => {
    // Issue 3 checks; MAC [pub: Allemang & Brown 1982], MPC [pub: Pappa et al. 1993]
    for (const r of runs) {
      expect(r.modes.length).toBe(3);
      frame.forEach((ref) => {
        const m = nearest(r.modes, ref.frequencyHz)!;
        expect(Math.abs(m.frequencyHz / ref.frequencyHz - 1)).toBeLessThan(0.003);
        expect(macReal(m.shape, ref.shape)).toBeGreaterThanOrEqual(0.99);
        expect(m.mpc).toBeGreaterThanOrEqual(0.99);
        expect(m.possiblyCoupled).toBe(false);
      });
    }
  });

  it("estimates damping by EFDD with a median over seeds within ±25 % of the true 1 %", () => {
    // [practice] REFERENCES.md: damping from one record scatters ±15–40 %; the median of 5 is tighter
    frame.forEach((ref) => {
      const z = runs.map((r) => nearest(r.modes, ref.frequencyHz)!).map((m) => {
        expect(m.dampingMethod).toBe("efdd");
        return m.dampingRatio!;
      });
      expect(Math.abs(median(z) / ref.dampingRatio - 1)).toBeLessThan(0.25);
    });
  });

  it("reports half-power damping with Q = 1/(2ζ) and η = 2ζ beside it", () => {
    const m = runs[0].modes[1];
    expect(m.halfPower).not.toBeNull();
    expect(m.halfPower!.q).toBeCloseTo(1 / (2 * m.halfPower!.dampingRatio), 10);
    expect(m.halfPower!.lossFactor).toBeCloseTo(2 * m.halfPower!.dampingRatio, 12);
  });

  it("returns s₁ ≥ s₂ ≥ s₃ on SciPy's frequency grid", () => {
    const sv = runs[0].singularValues;
    expect(sv.frequencyHz[1]).toBeCloseTo(FS / 2048, 12);
    for (let k = 0; k < sv.s1.length; k++) {
      expect(sv.s1[k]).toBeGreaterThanOrEqual(sv.s2![k]);
      expect(sv.s2![k]).toBeGreaterThanOrEqual(sv.s3![k]);
    }
  });
});

describe("identifyModes at coarse resolution", () => {
  it("reads damping high when the half-power bandwidth spans < 1.5 lines, and says so", () => {
    // [practice, REFERENCES.md known biases]: B_r = 2ζf < ~1.5 lines ⇒ +50 % to +300 %.
    // Mode 1: B_r = 0.03 Hz; nperseg 256 at 20 Hz gives Δf = 0.078 Hz (0.4 lines).
    const zEfdd: number[] = [];
    const zHp: number[] = [];
    for (const seed of [1, 2, 3]) {
      const sim = simulateAmbientRecord({ modes: frame, sampleRateHz: FS, durationS: 1200, seed });
      const r = identifyModes({ sampleRateHz: FS, channels: CH, data: sim.data }, { nperseg: 256 });
      const m = nearest(r.modes, frame[0].frequencyHz)!;
      expect(m.dampingReliable).toBe(false);
      zEfdd.push(m.efdd!.dampingRatio);
      zHp.push(m.halfPower!.dampingRatio);
    }
    expect(median(zEfdd)).toBeGreaterThan(1.5 * frame[0].dampingRatio);
    expect(median(zHp)).toBeGreaterThan(1.5 * frame[0].dampingRatio);
  });
});

describe("identifyModes on closely spaced modes", () => {
  // Bending-like and torsion-like shapes of a deck with 4 sensors (orthogonal).
  const A = [0.5, 1, 1, 0.5];
  const B = [1, 1, -1, -1];
  const rec = (sep: number, seed: number) => {
    const modes = [{ frequencyHz: 2, dampingRatio: 0.01, shape: A }, { frequencyHz: 2 * (1 + sep), dampingRatio: 0.01, shape: B }];
    return { modes, data: simulateAmbientRecord({ modes, sampleRateHz: FS, durationS: 3600, seed }).data };
  };
  const found = (ms: IdentifiedMode[], f: number, shape: number[], freqOf: (m: IdentifiedMode) => number | undefined) =>
    ms.some((m) => {
      const fm = freqOf(m);
      return fm !== undefined && Math.abs(fm / f - 1) < 0.003 && macReal(m.shape, shape) >= 0.95;
    });

  it("finds two modes 3 % apart: FDD alone in most records, FDD with SSI-COV in every record", () => {
    let fddBoth = 0;
    for (const seed of [1, 2, 3]) {
      const { modes, data } = rec(0.03, seed);
      const r = identifyModes({ sampleRateHz: FS, channels: ["A", "B", "C", "D"], data }, { nperseg: 2048, methods: ["fdd", "ssi"], ssi: { maxOrder: 20 } });
      const viaFdd = (m: IdentifiedMode) => (m.fdd ? m.frequencyHz : undefined);
      const any = (m: IdentifiedMode) => m.frequencyHz;
      if (found(r.modes, modes[0].frequencyHz, A, viaFdd) && found(r.modes, modes[1].frequencyHz, B, viaFdd)) fddBoth++;
      expect(found(r.modes, modes[0].frequencyHz, A, any)).toBe(true);
      expect(found(r.modes, modes[1].frequencyHz, B, any)).toBe(true);
    }
    expect(fddBoth).toBeGreaterThanOrEqual(2);
  });

  it("flags two modes 1 % apart as possibly coupled in FDD, and SSI-COV separates them", () => {
    const { modes, data } = rec(0.01, 2);
    const r = identifyModes({ sampleRateHz: FS, channels: ["A", "B", "C", "D"], data }, { nperseg: 2048, methods: ["fdd", "ssi"], ssi: { maxOrder: 20 } });
    const fddModes = r.modes.filter((m) => m.fdd !== null && Math.abs(m.frequencyHz - 2.01) < 0.05);
    expect(fddModes.length).toBeGreaterThanOrEqual(1);
    expect(fddModes.every((m) => m.possiblyCoupled)).toBe(true);
    const viaSsi = (m: IdentifiedMode) => m.ssi?.frequencyHz;
    expect(found(r.modes, modes[0].frequencyHz, A, viaSsi)).toBe(true);
    expect(found(r.modes, modes[1].frequencyHz, B, viaSsi)).toBe(true);
  });
});

describe("identifyModes validation", () => {
  const ok = { sampleRateHz: 20, channels: ["A", "B"], data: [new Float64Array(512), new Float64Array(512)] };
  it("refuses a malformed record or options with the rule and the value", () => {
    expect(() => identifyModes({ ...ok, sampleRateHz: -1 })).toThrow(/sampleRateHz must be > 0 \(got -1\)/);
    expect(() => identifyModes({ ...ok, channels: ["A"] })).toThrow(RangeError);
    expect(() => identifyModes({ ...ok, channels: ["A", "A"] })).toThrow(/distinct/);
    expect(() => identifyModes({ ...ok, data: [new Float64Array(512), new Float64Array(500)] })).toThrow(/length/);
    expect(() => identifyModes({ ...ok, data: [new Float64Array(100), new Float64Array(100)] })).toThrow(/at least 256/);
    expect(() => identifyModes(ok, { overlap: 0.95 })).toThrow(/overlap must be within \[0, 0.9\] \(got 0.95\)/);
    expect(() => identifyModes(ok, { methods: ["fft" as "fdd"] })).toThrow(/methods/);
    expect(() => identifyModes(ok, { nperseg: 200 })).toThrow(/power of two/);
    expect(() => identifyModes(null as unknown as typeof ok)).toThrow(TypeError);
  });

  it("rejects a record whose channels are all flat, without modes", () => {
    const r = identifyModes(ok);
    expect(r.quality.verdict.kind).toBe("reject");
    expect(r.modes).toHaveLength(0);
    expect(r.warnings.join(" ")).toMatch(/rejected/);
  });
});

describe("identifyModes stabilisation diagram data", () => {
  const sim = simulateAmbientRecord({ modes: frame, sampleRateHz: FS, durationS: 600, seed: 7 });

  it("is absent when SSI-COV did not run", () => {
    const r = identifyModes({ sampleRateHz: FS, channels: CH, data: sim.data }, { nperseg: 1024 });
    expect(r.stabilisation).toBeUndefined();
  });

  it("keeps SSI-COV's physical poles by order, with the closed-form modes stable in all criteria at high orders", () => {
    const maxOrder = 20;
    const r = identifyModes({ sampleRateHz: FS, channels: CH, data: sim.data }, { nperseg: 1024, methods: ["fdd", "ssi"], ssi: { maxOrder } });
    const st = r.stabilisation!;
    expect(st.length).toBeGreaterThan(0);
    // Orders are the even model orders 2…maxOrder; each order n has at most n/2 conjugate
    // pole pairs (state dimension n [pub: Peeters & De Roeck 1999, SSI-COV]).
    const perOrder = new Map<number, number>();
    for (const p of st) {
      expect(p.order % 2).toBe(0);
      expect(p.order).toBeGreaterThanOrEqual(2);
      expect(p.order).toBeLessThanOrEqual(maxOrder);
      expect(["new", "f", "fd", "fv", "fdv"]).toContain(p.stable);
      // Physical poles only: 0 < ζ ≤ 0.2 [practice], 0 < f < Nyquist.
      expect(p.dampingRatio).toBeGreaterThan(0);
      expect(p.dampingRatio).toBeLessThanOrEqual(0.2);
      expect(p.frequencyHz).toBeGreaterThan(0);
      expect(p.frequencyHz).toBeLessThan(FS / 2);
      perOrder.set(p.order, (perOrder.get(p.order) ?? 0) + 1);
    }
    for (const [order, n] of perOrder) expect(n).toBeLessThanOrEqual(order / 2);
    // Every closed-form mode [Chopra] is a column of poles: at the top half of the orders a
    // pole within 1 % of it is stable in frequency (label f*, tolerance 1 % between orders).
    for (const m of frame) {
      const high = st.filter((p) => p.order > maxOrder / 2 && Math.abs(p.frequencyHz / m.frequencyHz - 1) < 0.01);
      expect(high.length).toBeGreaterThanOrEqual(maxOrder / 4);
      expect(high.filter((p) => p.stable !== "new").length).toBeGreaterThanOrEqual(maxOrder / 4 - 1);
    }
  });
});
