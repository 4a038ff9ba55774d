/** A synthetic asset report for the layout tests: one mode with a seasonal-free trend and a 2 % drop in its last week. */
import { REPORT_CAUTION } from "@/lib/reports/caution";
import type { AssetReport } from "@/lib/reports/report-data";

const DAY = 86_400_000;

export function fixtureReport(): AssetReport {
  const from = Date.UTC(2026, 9, 1);
  const to = Date.UTC(2026, 10, 1);
  const points = [];
  const daily = [];
  for (let t = from; t < to; t += DAY / 4) {
    const drop = t > to - 7 * DAY ? 0.02 : 0;
    points.push({ atMs: t, frequencyHz: 2.4 * (1 - drop) + 0.004 * Math.sin(t / DAY), predictedHz: 2.4, dampingRatio: 0.012 });
  }
  for (let t = from; t < to; t += DAY) {
    const r = t > to - 7 * DAY ? -0.048 : 0.002 * Math.sin(t / DAY);
    daily.push({ dayMs: t, residualHz: r, ewma: r / 2, ewmaLcl: -0.01, ewmaUcl: 0.01 });
  }
  return {
    generatedAtMs: to + 3600_000, period: { fromMs: from, toMs: to }, organisationName: "Larkspur County Structures Office",
    asset: { id: "00000000-0000-4000-8000-000000000001", name: "Heron Reach Footbridge", kind: "footbridge", material: "steel truss", mainDimensionM: 42, expectedIntervalMin: 360, condition: "alert" },
    baseline: { version: 1, trainingFromMs: from - 365 * DAY, trainingToMs: from - 60 * DAY, status: "complete" },
    driftSkipped: null,
    modes: [{
      trackedModeId: "m1", label: "V1", nominalHz: 2.4, latestHz: 2.352, latestAtMs: to - DAY, medianHz: 2.4, medianDampingRatio: 0.012,
      identified: 118, accepted: 124, identificationRate: 118 / 124, sustainedChangePct: -2, minimalShift: { shiftHz: 0.006, shiftPct: 0.25 },
      fit: { kind: "linear", residualStdHz: 0.004, n: 1200, slopeHzPerC: -0.0021, temperatureRangeC: [-8, 31] },
      series: { points, daily },
    }],
    alerts: [{ id: "a1", raisedAtMs: to - 5 * DAY, state: "open", outcome: null, closedAtMs: null, inspectionAtMs: null, findings: null, rule: "ewma", modesBeyond: ["V1"] }],
    availability: { expected: 124, accepted: 124, rejected: 2, fromRecords: 124, coverage: 1, longestGapH: 7.5 },
    caution: REPORT_CAUTION, link: "http://127.0.0.1:3000/assets/00000000-0000-4000-8000-000000000001",
  };
}
