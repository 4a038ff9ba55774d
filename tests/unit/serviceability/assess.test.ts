import { describe, expect, it } from "vitest";
import { assessServiceability, familyOf, type AssessInput } from "@/lib/serviceability/assess";
import { mergeServiceabilityValues } from "@/lib/serviceability/values";

const base = (over: Partial<AssessInput>): AssessInput => ({
  kind: "footbridge", material: "Steel truss", values: mergeServiceabilityValues(), channelDirections: { A1: "z", A5: "y" },
  modes: [], observations: [], records: [], sectionWidthM: null, dampingGuidanceKey: null, ...over,
});

describe("assessServiceability", () => {
  it("sorts kinds into families", () => {
    expect(["footbridge", "pedestrian_bridge", "tower", "mast", "chimney", "other"].map(familyOf))
      .toEqual(["footbridge", "footbridge", "tower", "tower", "tower", "other"]);
  });

  it("takes a footbridge mode's direction from its shape when the label says nothing, and checks its median frequency", () => {
    const view = assessServiceability(base({
      modes: [{ id: "m", label: "Mode A", nominalFrequencyHz: 1.0, referenceShape: { A1: 0.1, A5: 1 }, designDirection: null }],
      observations: [1.05, 0.95, 1.1].map((f) => ({ trackedModeId: "m", frequencyHz: f, dampingRatio: 0.003, dampingReliable: true })),
    }));
    expect(view.modes[0]).toMatchObject({ direction: "lateral", directionFrom: "shape", measuredMedianHz: 1.05 });
    expect(view.modes[0].frequencyCheck).toMatchObject({ risk: "high", comfortCheckNeeded: true }); // 1.05 Hz in 0.5–1.2 Hz lateral
    expect(view.modes[0].damping.verdict).toBe("within_guidance"); // 0.3 % between steel 0.2 % and 0.4 %
  });

  it("gives the nearest-rank 95th percentile and counts records above the vertical maximum", () => {
    const records = Array.from({ length: 20 }, (_, i) => ({
      recordId: `r${i}`, atMs: i, windSpeedMps: null, channelsUsed: ["A1"],
      levels: [{ code: "A1", axis: "z" as const, peakMps2: (i + 1) / 20, maxRms1sMps2: 0.01, rmsMps2: 0.005 }],
    }));
    const v = assessServiceability(base({ records })).acceleration?.axes.find((a) => a.axis === "vertical");
    // Peaks 0.05…1.00 m/s²: rank ⌈0.95·20⌉ = 19 → 0.95; above 0.7 m/s²: 0.75…1.00 → 6 records.
    expect(v?.peak.p95).toBeCloseTo(0.95, 12);
    expect(v?.peak.exceedCount).toBe(6);
    expect(v?.peak.median).toBeCloseTo((0.5 + 0.55) / 2, 12);
  });

  it("leaves out channels the analysis did not use", () => {
    const records = [{
      recordId: "r", atMs: 0, windSpeedMps: null, channelsUsed: ["A1"],
      levels: [{ code: "A1", axis: "z" as const, peakMps2: 0.1, maxRms1sMps2: 0.05, rmsMps2: 0.02 }, { code: "A2", axis: "z" as const, peakMps2: 9, maxRms1sMps2: 9, rmsMps2: 9 }],
    }];
    expect(assessServiceability(base({ records })).acceleration?.axes[0].peak.max).toBe(0.1);
  });
});
