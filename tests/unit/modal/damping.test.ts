import { describe, expect, it } from "vitest";
import { dampingRatioFromLogDecrement, logDecrementFromDampingRatio, lossFactor, qualityFactor } from "@/lib/modal/damping";

describe("damping conversions", () => {
  // Table of REFERENCES.md [pub: Chopra, Dynamics of Structures, ch. 3]:
  // ζ 0.5 % → Q 100, η 0.010, δ 0.03142; ζ 1 % → Q 50, η 0.020, δ 0.06283; ζ 2 % → Q 25, η 0.040, δ 0.12569
  const table: [number, number, number, number][] = [
    [0.005, 100, 0.01, 0.03142],
    [0.01, 50, 0.02, 0.06283],
    [0.02, 25, 0.04, 0.12569],
  ];
  for (const [zeta, q, eta, delta] of table) {
    it(`gives Q ${q}, η ${eta}, δ ${delta} for ζ ${zeta}`, () => {
      expect(qualityFactor(zeta)).toBeCloseTo(q, 10);
      expect(lossFactor(zeta)).toBeCloseTo(eta, 12);
      expect(logDecrementFromDampingRatio(zeta)).toBeCloseTo(delta, 5);
      expect(dampingRatioFromLogDecrement(logDecrementFromDampingRatio(zeta))).toBeCloseTo(zeta, 14);
    });
  }
  it("refuses ratios outside (0, 1) and non-numbers", () => {
    expect(() => qualityFactor(0)).toThrow(/within \(0, 1\) \(got 0\)/);
    expect(() => lossFactor(1.2)).toThrow(RangeError);
    expect(() => logDecrementFromDampingRatio(Number.NaN)).toThrow(TypeError);
    expect(() => dampingRatioFromLogDecrement(-0.1)).toThrow(RangeError);
  });
});
