/**
 * Condition state machine: PRODUCT.md states, the run rule [pub: Montgomery ch. 5,
 * k-of-n sensitizing rules], hysteresis, silence and "out of envelope, no decision".
 */
import { describe, expect, it } from "vitest";
import { replayCondition, type ConditionPoint } from "@/lib/stats/condition-machine";

const DAY = 86_400_000;
function pt(day: number, residual: number, extra: Partial<ConditionPoint> = {}): ConditionPoint {
  return {
    timeMs: day * DAY,
    qualityPassed: true,
    outOfEnvelope: false,
    modes: [{ modeId: "m1", residualHz: residual, residualLcl: -3, residualUcl: 3, ewma: 0, lcl: -1, ucl: 1 }],
    ...extra,
  };
}

describe("replayCondition", () => {
  it("goes commissioning → steady → watch → alert on 3 of 5 residuals beyond, then steady after the hysteresis", () => {
    const pts = [pt(1, 0), pt(2, 4), pt(3, 0), pt(4, 5), pt(5, 4), ...Array.from({ length: 20 }, (_, i) => pt(6 + i, 0))];
    const r = replayCondition(pts, { hysteresisMs: 14 * DAY });
    expect(r.timeline.map((c) => c.state)).toEqual(["commissioning", "steady", "watch", "alert", "steady"]);
    const alert = r.events.find((e) => e.type === "alert_raised");
    expect(alert?.timeMs).toBe(5 * DAY);
    expect(r.timeline[4].fromMs).toBe(19 * DAY); // last beyond on day 5, + 14 days
  });

  it("makes no decision on out-of-envelope or quality-failed points", () => {
    const pts = [pt(1, 0), pt(2, 9, { outOfEnvelope: true }), pt(3, 9, { qualityPassed: false }), pt(4, 9, { outOfEnvelope: true })];
    expect(replayCondition(pts).timeline.map((c) => c.state)).toEqual(["commissioning", "steady"]);
  });

  it("raises an alert on an EWMA crossing sustained for sustainPoints", () => {
    const pts = Array.from({ length: 10 }, (_, i) => pt(i + 1, 0, { modes: [{ modeId: "m1", residualHz: 0, residualLcl: -3, residualUcl: 3, ewma: 2, lcl: -1, ucl: 1 }] }));
    const r = replayCondition(pts, { sustainPoints: 4 });
    expect(r.events.filter((e) => e.type === "alert_raised").map((e) => e.timeMs)).toEqual([4 * DAY]);
  });

  it("goes silent after the expected interval without records and resumes the previous state", () => {
    const r = replayCondition([pt(1, 0), pt(10, 0)], { recordTimesMs: [1 * DAY, 10 * DAY], expectedIntervalMs: 2 * DAY, endMs: 20 * DAY });
    expect(r.timeline.map((c) => [c.state, c.fromMs / DAY])).toEqual([
      ["commissioning", -Infinity], ["steady", 1], ["silent", 3], ["steady", 10], ["silent", 12],
    ]);
    expect(r.finalState).toBe("silent");
  });

  it("rejects points out of time order and m > n", () => {
    expect(() => replayCondition([pt(2, 0), pt(1, 0)])).toThrow(RangeError);
    expect(() => replayCondition([], { persistence: { m: 6, n: 5 } })).toThrow(RangeError);
  });
});
