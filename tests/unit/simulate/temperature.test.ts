import { describe, expect, it } from "vitest";
import { frequencyAtTemperature } from "@/lib/simulate/temperature";

// Bilinear relation with stiffening below 0 °C [pub: Peeters & De Roeck 2001].
const sens = { slopePerC: -0.002, knotC: 0, coldSlopePerC: -0.02 };

describe("frequencyAtTemperature", () => {
  it("returns f20 at 20 °C and follows the warm slope above the knot", () => {
    expect(frequencyAtTemperature(2.5, 20, sens)).toBe(2.5);
    expect(frequencyAtTemperature(2.5, 30, sens)).toBeCloseTo(2.5 * (1 - 0.02), 12);
  });

  it("is continuous at the knot and stiffens steeply below it", () => {
    const atKnot = frequencyAtTemperature(2.5, 0, sens);
    expect(frequencyAtTemperature(2.5, -1e-9, sens)).toBeCloseTo(atKnot, 9);
    expect(frequencyAtTemperature(2.5, -5, sens) - atKnot).toBeCloseTo(2.5 * 0.1, 12);
  });

  it("is linear when no cold slope is given", () => {
    expect(frequencyAtTemperature(1, -10, { slopePerC: -0.001 })).toBeCloseTo(1.03, 12);
  });

  it("refuses bad arguments", () => {
    expect(() => frequencyAtTemperature(0, 10, sens)).toThrow(/f20 must be > 0 \(got 0\)/);
    expect(() => frequencyAtTemperature(1, 100, sens)).toThrow(RangeError);
    expect(() => frequencyAtTemperature(1, 10, { slopePerC: NaN })).toThrow(TypeError);
    expect(() => frequencyAtTemperature(1, -60, { slopePerC: 0, coldSlopePerC: 0.1, knotC: 40 })).toThrow(/non-positive frequency/);
  });
});
