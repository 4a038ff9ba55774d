import { describe, expect, it } from "vitest";
import { applyDefects, type RecordDefect } from "@/lib/simulate/defects";
import { createRng } from "@/lib/simulate/rng";

const fs = 64;
const clean = () => [Float64Array.from({ length: 640 }, (_, k) => Math.sin(k / 5)), Float64Array.from({ length: 640 }, (_, k) => 0.5 * Math.cos(k / 7))];
const run = (defects: RecordDefect[]) => applyDefects(clean(), fs, defects, createRng(1));

describe("applyDefects", () => {
  it("puts a NaN run in the stated window of the stated channel only", () => {
    const { data } = run([{ kind: "nonFinite", channels: [1], startS: 1, durationS: 0.5 }]);
    expect(data[1].slice(64, 96).every(Number.isNaN)).toBe(true);
    expect(Number.isFinite(data[1][63]) && Number.isFinite(data[1][96])).toBe(true);
    expect(data[0].every(Number.isFinite)).toBe(true);
  });

  it("fills gaps with zeros or the last good value", () => {
    const before = clean();
    const zero = run([{ kind: "gap", startS: 2, durationS: 1, fill: "zero" }]).data;
    const hold = run([{ kind: "gap", startS: 2, durationS: 1, fill: "hold" }]).data;
    expect(zero[0].slice(128, 192).every((v) => v === 0)).toBe(true);
    expect(hold[1].slice(128, 192).every((v) => v === before[1][127])).toBe(true);
  });

  it("clips at ±full scale", () => {
    const { data } = run([{ kind: "clip", fullScale: 0.8 }]);
    expect(Math.max(...data[0])).toBe(0.8);
    expect(Math.min(...data[0])).toBe(-0.8);
    expect(Math.max(...data[1].map(Math.abs))).toBeLessThanOrEqual(0.5);
  });

  it("flat-lines a channel at its first value", () => {
    const { data } = run([{ kind: "flatLine", channels: [0], startS: 1 }]);
    expect(new Set(data[0].slice(64)).size).toBe(1);
  });

  it("adds the requested number of spikes of the given amplitude", () => {
    const before = clean();
    const { data } = run([{ kind: "spikes", channels: [0], count: 5, amplitude: 20 }]);
    const jumps = data[0].filter((v, k) => Math.abs(v - before[0][k]) > 1).length;
    expect(jumps).toBeGreaterThanOrEqual(4); // two spikes may land on one sample (P ≈ 1.6 %)
    expect(jumps).toBeLessThanOrEqual(5);
  });

  it("adds 50 Hz hum that folds to 14 Hz at fs = 64 Hz", () => {
    // REFERENCES.md §Data quality [practice]: fs = 64 Hz folds 50 Hz to 14 Hz.
    const zeros = [new Float64Array(640)];
    const { data } = applyDefects(zeros, fs, [{ kind: "hum", frequencyHz: 50, amplitude: 0.1 }], createRng(1));
    // Project on a 14 Hz tone over an integer number of its periods (640 samples = 140 periods).
    let c = 0, s = 0;
    for (let k = 0; k < 640; k++) {
      c += data[0][k] * Math.cos((2 * Math.PI * 14 * k) / fs);
      s += data[0][k] * Math.sin((2 * Math.PI * 14 * k) / fs);
    }
    expect((2 * Math.hypot(c, s)) / 640).toBeCloseTo(0.1, 10);
  });

  it("adds an offset and a linear drift", () => {
    const before = clean();
    const { data } = run([{ kind: "offset", channels: [1], value: 0.3 }, { kind: "drift", channels: [1], ratePerS: 0.01 }]);
    expect(data[1][0] - before[1][0]).toBeCloseTo(0.3, 12);
    expect(data[1][639] - before[1][639]).toBeCloseTo(0.3 + (0.01 * 639) / fs, 12);
  });

  it("does not mutate the input and warns when a window runs past the end", () => {
    const input = clean();
    const copy = input.map((c) => Array.from(c));
    const res = applyDefects(input, fs, [{ kind: "nonFinite", startS: 9.5, durationS: 2 }], createRng(1));
    expect(input.map((c) => Array.from(c))).toEqual(copy);
    expect(res.warnings.length).toBe(2);
  });

  it("refuses bad arguments with the rule and the value", () => {
    const rng = createRng(1);
    expect(() => applyDefects(clean(), fs, [{ kind: "clip", fullScale: 0 }], rng)).toThrow(/fullScale must be > 0 \(got 0\)/);
    expect(() => applyDefects(clean(), fs, [{ kind: "offset", channels: [2], value: 1 }], rng)).toThrow(/channels\[0\] must be ≤ 1 \(got 2\)/);
    expect(() => applyDefects(clean(), fs, [{ kind: "bogus" } as unknown as RecordDefect], rng)).toThrow(TypeError);
    expect(() => applyDefects(clean(), 0, [], rng)).toThrow(RangeError);
    expect(() => applyDefects([new Float64Array(3), new Float64Array(4)], fs, [], rng)).toThrow(RangeError);
    expect(() => applyDefects(clean(), fs, [{ kind: "gap", startS: -1, durationS: 1, fill: "nan" }], rng)).toThrow(RangeError);
  });
});
