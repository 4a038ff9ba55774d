/**
 * Each data-quality defect of REFERENCES.md §Data quality [practice] is detected on a record
 * that has it, and a clean record is not flagged.
 */
import { describe, expect, it } from "vitest";
import { aliasFrequency, screenRecord, type QualityFlag } from "@/lib/signal/quality";
import { applyDefects, createRng, simulateAmbientRecord, type RecordDefect } from "@/lib/simulate";

const FS = 64;
const CH = ["C1", "C2", "C3", "C4"];
const clean = simulateAmbientRecord({
  modes: [
    { frequencyHz: 1.7, dampingRatio: 0.01, shape: [0.4, 0.8, 1, 0.9] },
    { frequencyHz: 5.2, dampingRatio: 0.015, shape: [1, 0.3, -0.6, -1] },
  ],
  sampleRateHz: FS,
  durationS: 300,
  seed: 11,
}).data;

function withDefect(d: RecordDefect): Float64Array[] {
  return applyDefects(clean, FS, [d], createRng(5)).data;
}
function flagsOf(data: Float64Array[], opts = {}): QualityFlag[][] {
  return screenRecord(data, CH, FS, opts).channels.map((c) => c.flags);
}

describe("screenRecord", () => {
  it("does not flag a clean record and accepts it", () => {
    const r = screenRecord(clean, CH, FS, { fullScale: 2, historyRms: clean.map(() => null) });
    expect(r.channels.map((c) => c.flags)).toEqual([[], [], [], []]);
    expect(r.verdict).toEqual({ kind: "accept" });
  });

  const cases: [string, RecordDefect, QualityFlag, object?][] = [
    ["non-finite samples", { kind: "nonFinite", channels: [1], startS: 10, durationS: 1 / FS }, "non_finite"],
    ["a NaN gap", { kind: "gap", channels: [1], startS: 10, durationS: 2, fill: "nan" }, "gap"],
    ["a zero-filled gap", { kind: "gap", channels: [1], startS: 10, durationS: 2, fill: "zero" }, "gap"],
    ["clipping at a stated full scale", { kind: "clip", channels: [1], fullScale: 0.01 }, "clipping", { fullScale: [2, 0.0101, 2, 2] }],
    ["clipping without a stated full scale (flat tops)", { kind: "clip", channels: [1], fullScale: 0.01 }, "clipping"],
    ["a flat-lined channel", { kind: "flatLine", channels: [1], startS: 20, durationS: 30 }, "flat_line"],
    ["spikes (MAD rule)", { kind: "spikes", channels: [1], count: 3, amplitude: 0.5 }, "spikes"],
    ["50 Hz hum aliased to 14 Hz at 64 Hz", { kind: "hum", channels: [1], frequencyHz: 50, amplitude: 0.003 }, "mains_hum"],
  ];
  for (const [name, defect, flag, opts] of cases) {
    it(`detects ${name} on that channel only`, () => {
      const flags = flagsOf(withDefect(defect), opts ?? {});
      expect(flags[1]).toContain(flag);
      [0, 2, 3].forEach((c) => expect(flags[c]).toEqual([]));
    });
  }

  it("flags an RMS far from the channel's history", () => {
    const rms = screenRecord(clean, CH, FS).channels.map((c) => c.rms);
    const hist = rms.map((v, i) => (i === 2 ? v * 5 : v));
    const flags = flagsOf(clean, { historyRms: hist });
    expect(flags[2]).toEqual(["rms_out_of_history"]);
    expect(flags[0]).toEqual([]);
  });

  it("accepts without a broken channel, and rejects when fewer than 2 channels remain", () => {
    const one = withDefect({ kind: "flatLine", channels: [3] });
    expect(screenRecord(one, CH, FS).verdict).toEqual({ kind: "accept_without", channels: ["C4"] });
    const three = withDefect({ kind: "flatLine", channels: [0, 1, 3] });
    const v = screenRecord(three, CH, FS).verdict;
    expect(v.kind).toBe("reject");
  });

  it("folds mains frequencies as REFERENCES.md: 50 Hz at fs = 64 Hz appears at 14 Hz", () => {
    expect(aliasFrequency(50, 64)).toBeCloseTo(14, 12);
    expect(aliasFrequency(60, 200)).toBeCloseTo(60, 12);
    expect(aliasFrequency(100, 64)).toBeCloseTo(28, 12);
  });

  it("refuses bad arguments", () => {
    expect(() => screenRecord(clean, ["A"], FS)).toThrow(RangeError);
    expect(() => screenRecord(clean, CH, 0)).toThrow(/sampleRateHz must be > 0/);
    expect(() => screenRecord(clean, CH, FS, { fullScale: -1 })).toThrow(/fullScale\[0\] must be > 0/);
    expect(() => screenRecord(clean, CH, FS, { historyFactor: 1 })).toThrow(/historyFactor must be > 1/);
    expect(() => screenRecord([new Float64Array(10)], ["A"], FS)).toThrow(/at least 64/);
    expect(() => screenRecord("x" as unknown as Float64Array[], CH, FS)).toThrow(TypeError);
  });
});
