import { describe, expect, it } from "vitest";
import { mac, macReal, mpc } from "@/lib/modal/mac";

describe("macReal", () => {
  // Test vectors: REFERENCES.md §Modal identification, MAC [pub: Allemang & Brown 1982]
  it("is 1 for collinear vectors", () => {
    expect(macReal([1, 2, 3], [2, 4, 6])).toBeCloseTo(1, 12);
  });
  it("is 0 for orthogonal vectors", () => {
    expect(macReal([1, 0], [0, 1])).toBe(0);
  });
  it("gives 0.99206 for [1,2,3] vs [1,2,2.5]", () => {
    expect(macReal([1, 2, 3], [1, 2, 2.5])).toBeCloseTo(0.99206, 5);
  });
  it("refuses unequal lengths, zero vectors and non-finite values", () => {
    expect(() => macReal([1, 2], [1, 2, 3])).toThrow(RangeError);
    expect(() => macReal([0, 0], [1, 2])).toThrow(/zero vector/);
    expect(() => macReal([Number.NaN, 1], [1, 2])).toThrow(TypeError);
    expect(() => macReal("ab" as unknown as number[], [1, 2])).toThrow(TypeError);
  });
});

describe("mac", () => {
  it("is invariant to a complex scale factor of either vector", () => {
    // |aᴴ(cb)|² = |c|²|aᴴb|², so MAC(a, cb) = MAC(a, b) [pub: Allemang & Brown 1982, definition]
    const a = { re: [1, 2, 3], im: [0, 0, 0] };
    const c = { re: Math.cos(0.7), im: Math.sin(0.7) };
    const b = { re: [2, 4, 6].map((x) => 3 * x * c.re), im: [2, 4, 6].map((x) => 3 * x * c.im) };
    expect(mac(a, b)).toBeCloseTo(1, 12);
  });
  it("equals macReal for real vectors", () => {
    const a = [1, 2, 3];
    const b = [1, 2, 2.5];
    expect(mac({ re: a, im: [0, 0, 0] }, { re: b, im: [0, 0, 0] })).toBeCloseTo(0.99206, 5);
  });
  it("is 0 for [1, j] against [1, -j]·… orthogonal complex pair", () => {
    // aᴴb = 1·1 + conj(j)·(−j)·… : with a=[1, j], b=[1, −j]: aᴴb = 1 + (−j)(−j) = 1 − 1 = 0
    expect(mac({ re: [1, 0], im: [0, 1] }, { re: [1, 0], im: [0, -1] })).toBeCloseTo(0, 15);
  });
  it("refuses mismatched parts", () => {
    expect(() => mac({ re: [1, 2], im: [0] }, { re: [1, 2], im: [0, 0] })).toThrow(RangeError);
    expect(() => mac(null as unknown as { re: number[]; im: number[] }, { re: [1], im: [0] })).toThrow(TypeError);
  });
});

describe("mpc", () => {
  // Test vectors: REFERENCES.md §Modal identification, MPC [pub: Pappa, Elliott & Schenk 1993]
  it("is 1 for a real vector rotated by e^{jθ}", () => {
    const th = 1.1;
    const v = [0.3, -1, 0.7];
    expect(mpc({ re: v.map((x) => x * Math.cos(th)), im: v.map((x) => x * Math.sin(th)) })).toBeCloseTo(1, 12);
  });
  it("is 0 for [1, j]", () => {
    expect(mpc({ re: [1, 0], im: [0, 1] })).toBeCloseTo(0, 15);
  });
  it("is 0.5 for [1, e^{jπ/4}]", () => {
    expect(mpc({ re: [1, Math.SQRT1_2], im: [0, Math.SQRT1_2] })).toBeCloseTo(0.5, 12);
  });
  it("refuses the zero vector", () => {
    expect(() => mpc({ re: [0, 0], im: [0, 0] })).toThrow(RangeError);
  });
});
