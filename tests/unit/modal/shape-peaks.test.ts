import { describe, expect, it } from "vitest";
import { realiseShape } from "@/lib/modal/shape";
import { pickFddPeaks, prominences } from "@/lib/modal/peak-picking";
import { decomposeCsdMatrix } from "@/lib/modal/fdd";
import { estimateCsdMatrix } from "@/lib/signal/welch-csd";
import { createRng } from "@/lib/simulate";

describe("realiseShape", () => {
  it("undoes a global rotation and normalises max |φ| = 1 with the largest positive", () => {
    const v = [0.2, -0.5, -1, 0.7];
    const th = 2.2;
    const s = realiseShape({ re: v.map((x) => x * Math.cos(th)), im: v.map((x) => x * Math.sin(th)) });
    // the largest component (−1) becomes +1, so the whole vector flips sign
    v.forEach((x, i) => expect(s[i]).toBeCloseTo(-x, 12));
  });
  it("refuses the zero vector", () => {
    expect(() => realiseShape({ re: [0, 0], im: [0, 0] })).toThrow(RangeError);
  });
});

describe("prominences", () => {
  it("follows scipy.signal.peak_prominences on a small example", () => {
    // [lib] scipy: x = [0, 2, 1, 3, 0, 1, 0] → peaks 1, 3, 5 with prominences 1, 3, 1
    expect(prominences([0, 2, 1, 3, 0, 1, 0], 0, 6)).toEqual([[1, 1], [3, 3], [5, 1]]);
  });
});

describe("pickFddPeaks", () => {
  const rng = createRng(3);
  const data = [0, 1].map(() => Float64Array.from({ length: 4096 }, () => rng.normal()));
  const fdd = decomposeCsdMatrix(estimateCsdMatrix(data, 10, { nperseg: 256 }));
  it("finds no mode in white noise", () => {
    expect(pickFddPeaks(fdd).peaks).toEqual([]);
  });
  it("warns about an empty search band", () => {
    expect(pickFddPeaks(fdd, { bandsHz: [[1, 2]] }).warnings[0]).toMatch(/band 1–2 Hz/);
  });
  it("refuses bad options", () => {
    expect(() => pickFddPeaks(fdd, { bandsHz: [[2, 1]] })).toThrow(/0 ≤ lo < hi \(got 2–1\)/);
    expect(() => pickFddPeaks(fdd, { minProminenceDb: 0 })).toThrow(RangeError);
    expect(() => pickFddPeaks(fdd, { minCoherence: 2 })).toThrow(/minCoherence must be within \[0, 1\] \(got 2\)/);
    expect(() => pickFddPeaks(fdd, { maxFrequencyHz: 50 })).toThrow(RangeError);
  });
});

describe("validation gates of FDD and EFDD", () => {
  const rng = createRng(9);
  const data = [0, 1, 2].map(() => Float64Array.from({ length: 2048 }, () => rng.normal()));
  const csd = estimateCsdMatrix(data, 10, { nperseg: 128 });
  const fdd = decomposeCsdMatrix(csd);
  it("decomposeCsdMatrix refuses a non-CSD object and a bad vector count", () => {
    expect(() => decomposeCsdMatrix({} as typeof csd)).toThrow(TypeError);
    expect(() => decomposeCsdMatrix(csd, 4)).toThrow(/vectors must be ≤ 3 \(got 4\)/);
    expect(() => decomposeCsdMatrix({ ...csd, re: csd.re.subarray(1) })).toThrow(RangeError);
  });
  it("estimateEfdd refuses a line off the spectrum and a shape of the wrong length", async () => {
    const { estimateEfdd } = await import("@/lib/modal/efdd");
    const v = { re: [1, 0, 0], im: [0, 0, 0] };
    expect(() => estimateEfdd(fdd, 0, v)).toThrow(/peakLine must be ≥ 1 \(got 0\)/);
    expect(() => estimateEfdd(fdd, 10, { re: [1, 0], im: [0, 0] })).toThrow(RangeError);
    expect(() => estimateEfdd(fdd, 10, v, 0)).toThrow(RangeError);
  });
});
