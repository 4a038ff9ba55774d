import { describe, expect, it } from "vitest";
import { modesOfShearModel, shearFrameModes } from "@/lib/simulate/shear-frame";

const TWO_PI = 2 * Math.PI;

describe("shearFrameModes", () => {
  it("matches the closed-form ratios ω/√(k/m) of a uniform 3-storey building", () => {
    // Chopra, Dynamics of Structures [pub]: N = 3 → 0.445042, 1.246980, 1.801938.
    const k = 4.0e6, m = 2.5e4;
    const ratios = shearFrameModes(3, k, m).map((mode) => (TWO_PI * mode.frequencyHz) / Math.sqrt(k / m));
    [0.445042, 1.24698, 1.801938].forEach((r, i) => expect(ratios[i]).toBeCloseTo(r, 6));
  });

  it("normalises shapes to max |φ| = 1 with the top floor positive, the first mode without sign change", () => {
    const modes = shearFrameModes(5, 1e6, 1e4);
    for (const mode of modes) {
      expect(Math.max(...mode.shape.map(Math.abs))).toBeCloseTo(1, 14);
      expect(mode.shape[4]).toBeGreaterThan(0);
    }
    expect(modes[0].shape.every((x) => x > 0)).toBe(true);
    // Mode j of a chain has j − 1 sign changes (Sturm sequence property) [pub: Chopra].
    modes.forEach((mode, j) => {
      let changes = 0;
      for (let i = 1; i < mode.shape.length; i++) if (mode.shape[i] * mode.shape[i - 1] < 0) changes++;
      expect(changes).toBe(j);
    });
  });

  it("refuses a bad storey count, stiffness or mass", () => {
    expect(() => shearFrameModes(0, 1, 1)).toThrow(RangeError);
    expect(() => shearFrameModes(2.5, 1, 1)).toThrow(TypeError);
    expect(() => shearFrameModes(3, -1, 1)).toThrow(/storeyStiffnessNPerM must be > 0 \(got -1\)/);
    expect(() => shearFrameModes(3, 1, NaN)).toThrow(TypeError);
  });
});

describe("modesOfShearModel", () => {
  it("reproduces the two-storey frame example (m₁ = 2m, m₂ = m, k₁ = 2k, k₂ = k)", () => {
    // Chopra, ch. 10 example [pub]: ω₁² = k/(2m), ω₂² = 2k/m, φ₁ = [0.5, 1], φ₂ = [−1, 1].
    const k = 3.0e5, m = 1.2e3;
    const modes = modesOfShearModel([2 * m, m], [2 * k, k]);
    expect((TWO_PI * modes[0].frequencyHz) ** 2 / (k / (2 * m))).toBeCloseTo(1, 12);
    expect((TWO_PI * modes[1].frequencyHz) ** 2 / ((2 * k) / m)).toBeCloseTo(1, 12);
    [0.5, 1].forEach((v, i) => expect(modes[0].shape[i]).toBeCloseTo(v, 12));
    [-1, 1].forEach((v, i) => expect(modes[1].shape[i]).toBeCloseTo(v, 12));
  });

  it("agrees with the closed form for a uniform 12-storey building", () => {
    const n = 12, k = 8e6, m = 3e4;
    const general = modesOfShearModel(new Array(n).fill(m), new Array(n).fill(k));
    const closed = shearFrameModes(n, k, m);
    // Eigen solver accuracy ~ n·‖K‖·ε relative to the largest eigenvalue; 1e-9 is far above it.
    closed.forEach((c, j) => {
      expect(general[j].frequencyHz / c.frequencyHz).toBeCloseTo(1, 9);
      c.shape.forEach((v, i) => expect(general[j].shape[i]).toBeCloseTo(v, 9));
    });
  });

  it("does not mutate its inputs", () => {
    const masses = [1, 2, 3], ks = [3, 2, 1];
    modesOfShearModel(masses, ks);
    expect(masses).toEqual([1, 2, 3]);
    expect(ks).toEqual([3, 2, 1]);
  });

  it("refuses unequal lengths, non-positive values and non-arrays", () => {
    expect(() => modesOfShearModel([1, 2], [1])).toThrow(/stiffnessesNPerM must have the length of massesKg \(got 1 ≠ 2\)/);
    expect(() => modesOfShearModel([1, 0], [1, 1])).toThrow(/massesKg\[1\] must be > 0 \(got 0\)/);
    expect(() => modesOfShearModel([1, 1], [1, -2])).toThrow(RangeError);
    expect(() => modesOfShearModel("12" as unknown as number[], [1])).toThrow(TypeError);
    expect(() => modesOfShearModel([1, NaN], [1, 1])).toThrow(TypeError);
  });
});
