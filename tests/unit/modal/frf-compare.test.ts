import { describe, expect, it } from "vitest";
import { estimateFrfH1 } from "@/lib/modal/frf";
import { compareFrfWithAmbient } from "@/lib/modal/frf-compare";
import { identifyFrfModes } from "@/lib/modal/frf-modes";
import { identifyModesSsiCov } from "@/lib/modal/ssi-cov";
import { simulateAmbientRecord } from "@/lib/simulate/ambient";
import { simulateForcedTest } from "@/lib/simulate/forced";

const modes = [
  { frequencyHz: 2.2, dampingRatio: 0.015, shape: [1, 0.5, -0.3] },
  { frequencyHz: 5.1, dampingRatio: 0.015, shape: [-0.6, 1, 0.8] },
];

describe("compareFrfWithAmbient", () => {
  it("pairs forced-test and ambient modes of one structure with MAC ≥ 0.99 and |Δf| < 0.5 %", () => {
    const forced = simulateForcedTest({ modes, driveChannel: 0, sampleRateHz: 100, durationS: 1200, seed: 2, excitation: { kind: "random", forceRmsN: 20 }, responseSnrDb: 30 });
    const frfModes = identifyFrfModes(estimateFrfH1({ sampleRateHz: 100, force: forced.force, responses: forced.data }, { nperseg: 8192 })).modes;
    const ambient = simulateAmbientRecord({ modes, sampleRateHz: 50, durationS: 1200, seed: 3, snrDb: 30 });
    const ssi = identifyModesSsiCov({ sampleRateHz: 50, channels: ["A", "B", "C"], data: ambient.data }, { maxOrder: 30 });
    const pairs = compareFrfWithAmbient(frfModes, ssi.modes);
    expect(pairs.length).toBe(2);
    pairs.forEach((p, j) => {
      expect(p.ambientIndex).toBe(j);
      // Both estimates of one real mode: MAC ≥ 0.99 [practice]; frequency: FRF peak within a
      // quarter line (0.003 Hz) and SSI within ~0.2 % for 20 minutes [practice] → 0.5 %.
      expect(p.mac ?? 0).toBeGreaterThanOrEqual(0.99);
      expect(Math.abs(p.frequencyDifferencePct ?? 99)).toBeLessThan(0.5);
    });
  });

  it("computes MAC and the frequency difference of given shapes, and leaves far modes unpaired", () => {
    // MAC([1,2,3],[1,2,2.5]) = 0.99206 [pub: REFERENCES.md test vector].
    const pairs = compareFrfWithAmbient(
      [{ frequencyHz: 2, shape: [1, 2, 3] }, { frequencyHz: 9, shape: [1, 0, 0] }],
      [{ frequencyHz: 2.04, shape: { re: [1, 2, 2.5], im: [0, 0, 0] } }],
    );
    expect(pairs[0].mac).toBeCloseTo(0.99206, 5);
    expect(pairs[0].frequencyDifferencePct).toBeCloseTo(2, 10);
    expect(pairs[1]).toEqual({ forcedIndex: 1, ambientIndex: null, mac: null, frequencyDifferencePct: null });
  });

  it("refuses malformed modes and windows", () => {
    const f = [{ frequencyHz: 2, shape: [1, 2] }];
    expect(() => compareFrfWithAmbient(f, [{ frequencyHz: 2, shape: { re: [1], im: [0] } }])).toThrow(/must have 2 entries \(got 1\)/);
    expect(() => compareFrfWithAmbient(f, [], 0)).toThrow(RangeError);
    expect(() => compareFrfWithAmbient([{ frequencyHz: -1, shape: [1] }], [])).toThrow(RangeError);
    expect(() => compareFrfWithAmbient("x" as unknown as typeof f, [])).toThrow(TypeError);
  });
});
