import { describe, expect, it } from "vitest";
import { compareDesignModes, median, shapeMac } from "@/lib/serviceability/design-compare";

const tracked = (id: string, f: number, freqs: number[], shape: Record<string, number> | null = null) =>
  ({ id, label: `T ${f}`, nominalFrequencyHz: f, frequenciesHz: freqs, shape });
const design = (id: string, f: number, link: string | null = null, shape: Record<string, number> | null = null) =>
  ({ id, label: `D ${f}`, frequencyHz: f, trackedModeId: link, shape });

describe("compareDesignModes", () => {
  it("pairs by nearest frequency within ±25 % and gives measured median / design", () => {
    const rows = compareDesignModes([design("d1", 3.0), design("d2", 12.0)], [tracked("t1", 3.12, [3.1, 3.12, 3.2]), tracked("t2", 4.35, [4.3])]);
    const d1 = rows.find((r) => r.design?.id === "d1");
    expect(d1).toMatchObject({ matchedBy: "frequency", measuredMedianHz: 3.12, measuredLatestHz: 3.2, identifications: 3, flag: null });
    expect(d1?.ratio).toBeCloseTo(3.12 / 3.0, 12); // 1.04
    // 12 Hz has no tracked mode within 9–15 Hz; 4.35 Hz has no design mode.
    expect(rows.find((r) => r.design?.id === "d2")).toMatchObject({ flag: "no_measured_mode", ratio: null, tracked: null });
    expect(rows.find((r) => r.tracked?.id === "t2")).toMatchObject({ flag: "no_design_mode", design: null });
  });

  it("lets an explicit link win over the nearest frequency, and uses each tracked mode once", () => {
    const rows = compareDesignModes([design("d1", 3.0, "t2"), design("d2", 3.1)], [tracked("t1", 3.05, [3.05]), tracked("t2", 3.3, [3.3])]);
    expect(rows.find((r) => r.design?.id === "d1")).toMatchObject({ matchedBy: "link", tracked: { id: "t2" } });
    expect(rows.find((r) => r.design?.id === "d2")).toMatchObject({ matchedBy: "frequency", tracked: { id: "t1" } });
  });

  it("flags a matched mode without identifications in the period", () => {
    const [row] = compareDesignModes([design("d1", 2.0)], [tracked("t1", 2.1, [])]);
    expect(row).toMatchObject({ flag: "not_identified_in_period", ratio: null, measuredMedianHz: null });
  });

  it("gives MAC 1 for proportional shapes and 0 for orthogonal ones over the shared channels", () => {
    const [same] = compareDesignModes([design("d", 3, null, { A1: 0.5, A2: 1, X: 9 })], [tracked("t", 3, [3], { A1: 1, A2: 2 })]);
    expect(same.mac).toBeCloseTo(1, 12);
    expect(shapeMac({ A1: 1, A2: 0 }, { A1: 0, A2: 1 })).toBe(0);
    expect(shapeMac({ A1: 1 }, { A1: 1 })).toBeNull(); // one shared channel: no MAC
  });

  it("takes the middle value as the median", () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 2, 3])).toBe(2.5);
    expect(median([])).toBeNull();
  });
});
