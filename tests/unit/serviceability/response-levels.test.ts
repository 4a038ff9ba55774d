import { describe, expect, it } from "vitest";
import { aggregateResponseLevels, computeChannelResponseLevels, computeResponseLevels } from "@/lib/signal/response-levels";

/** A cosine of amplitude `a`, frequency `f` Hz, `seconds` long at `fs` Hz, plus `offset`. */
function cosine(a: number, f: number, fs: number, seconds: number, offset = 0): Float64Array {
  return Float64Array.from({ length: fs * seconds }, (_, k) => offset + a * Math.cos((2 * Math.PI * f * k) / fs));
}

describe("computeResponseLevels", () => {
  it("gives peak A and 1-s RMS A/√2 for a sine (whole periods per second) [analytic]", () => {
    const levels = computeResponseLevels({
      sampleRateHz: 200, units: "m/s2", channels: [{ code: "A1", direction: "z" }], data: [cosine(0.3, 2, 200, 10)],
    });
    expect(levels).toHaveLength(1);
    expect(levels[0].axis).toBe("z");
    expect(levels[0].peakMps2).toBeCloseTo(0.3, 12);
    expect(levels[0].maxRms1sMps2).toBeCloseTo(0.3 / Math.SQRT2, 12);
    expect(levels[0].rmsMps2).toBeCloseTo(0.3 / Math.SQRT2, 12);
  });

  it("converts mg to m/s² (g_n = 9.80665 m/s², ISO 80000-3) and removes an offset", () => {
    const [l] = computeResponseLevels({
      sampleRateHz: 100, units: "mg", channels: [{ code: "A5", direction: "-y" }], data: [cosine(100, 1, 100, 6, 1000)],
    });
    expect(l.axis).toBe("y");
    expect(l.peakMps2).toBeCloseTo(0.980665, 9); // 100 mg
    expect(l.maxRms1sMps2).toBeCloseTo(0.980665 / Math.SQRT2, 9);
  });

  it("finds the loudest second: a 2-s burst on a quiet record", () => {
    const fs = 100;
    const x = cosine(0.01, 5, fs, 20);
    for (let k = 5 * fs; k < 7 * fs; k++) x[k] = 0.5 * Math.cos((2 * Math.PI * 5 * k) / fs); // burst amplitude 0.5
    const [l] = computeResponseLevels({ sampleRateHz: fs, units: "m/s2", channels: [{ code: "A1", direction: "z" }], data: [x] });
    expect(l.peakMps2).toBeCloseTo(0.5, 2); // mean shift of the burst is < 1e-3
    expect(l.maxRms1sMps2).toBeCloseTo(0.5 / Math.SQRT2, 2);
    // Whole-record mean square: (18 s × 0.01²/2 + 2 s × 0.5²/2) / 20 s.
    expect(l.rmsMps2).toBeCloseTo(Math.sqrt((18 * 0.01 ** 2 / 2 + 2 * 0.5 ** 2 / 2) / 20), 3);
  });

  it("groups channels by axis and names the channel of the peak", () => {
    const levels = computeResponseLevels({
      sampleRateHz: 50, units: "m/s2",
      channels: [{ code: "A1", direction: "z" }, { code: "A2", direction: "z" }, { code: "A5", direction: "x" }],
      data: [cosine(0.1, 1, 50, 4), cosine(0.2, 1, 50, 4), cosine(0.05, 1, 50, 4)],
    });
    expect(levels.map((l) => l.axis)).toEqual(["x", "z"]);
    expect(levels[1].peakChannel).toBe("A2");
    expect(levels[1].peakMps2).toBeCloseTo(0.2, 12);
  });

  it("rejects mismatched channel counts and a bad rate", () => {
    expect(() => computeResponseLevels({ sampleRateHz: 50, units: "m/s2", channels: [], data: [new Float64Array(4)] })).toThrow(RangeError);
    expect(() => computeResponseLevels({ sampleRateHz: 0, units: "m/s2", channels: [], data: [] })).toThrow(RangeError);
  });
});

describe("aggregateResponseLevels", () => {
  it("leaves out channels not included (e.g. excluded by quality screening)", () => {
    const channel = computeChannelResponseLevels({
      sampleRateHz: 50, units: "m/s2",
      channels: [{ code: "A1", direction: "z" }, { code: "A2", direction: "z" }, { code: "F1", direction: "" }],
      data: [cosine(0.1, 1, 50, 4), cosine(0.9, 1, 50, 4), cosine(5, 1, 50, 4)],
    });
    expect(channel.map((c) => c.code)).toEqual(["A1", "A2"]); // F1 has no axis
    const [z] = aggregateResponseLevels(channel, new Set(["A1"]));
    expect(z.peakChannel).toBe("A1");
    expect(z.peakMps2).toBeCloseTo(0.1, 12);
  });
});
