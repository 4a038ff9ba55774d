/** Daily/hourly aggregation of residuals and the autocorrelation-corrected chart σ. */
import { describe, expect, it } from "vitest";
import { aggregateResiduals } from "@/lib/stats/aggregate";
import { estimateChartSigma } from "@/lib/stats/chart-sigma";
import { createRng } from "@/lib/simulate/rng";

const H = 3_600_000;
describe("aggregateResiduals", () => {
  it("averages per UTC day, skips NaN, honours the offset and hourly buckets", () => {
    const t = [0, 6 * H, 23 * H, 25 * H, 49 * H];
    const a = aggregateResiduals(t, [[1, 2, Number.NaN, 4, 5]]);
    expect(a.bucketStartMs).toEqual([0, 24 * H, 48 * H]);
    expect(Array.from(a.mean[0])).toEqual([1.5, 4, 5]);
    expect(Array.from(a.count[0])).toEqual([2, 1, 1]);
    const shifted = aggregateResiduals(t, [[1, 2, 3, 4, 5]], { offsetMs: -2 * H });
    expect(shifted.bucketStartMs[0]).toBe(-2 * H);
    expect(Array.from(shifted.mean[0])).toEqual([1.5, 3.5, 5]); // 23 h moves into the next day
    expect(aggregateResiduals(t, [[1, 2, 3, 4, 5]], { bucket: "hour" }).bucketStartMs.length).toBe(5);
    expect(() => aggregateResiduals(t, [[1, 2]])).toThrow(RangeError);
  });
});

describe("estimateChartSigma", () => {
  it("inflates σ by √((1+φ)/(1−φ)), φ = ρ(1−λ), for AR(1) data (stationary EWMA variance)", () => {
    // [pub] Montgomery ch. 10 / Box–Jenkins AR(1): corr at lag 1 = ρ
    const rng = createRng(9);
    const rho = 0.6;
    const x = new Float64Array(20000);
    for (let i = 1; i < x.length; i++) x[i] = rho * x[i - 1] + Math.sqrt(1 - rho * rho) * rng.normal();
    const s = estimateChartSigma(x, 0.1);
    expect(s.lag1Autocorrelation).toBeGreaterThan(0.57); // SE of ρ̂ ≈ √((1−ρ²)/n) ≈ 0.006
    expect(s.lag1Autocorrelation).toBeLessThan(0.63);
    const phi = s.lag1Autocorrelation * 0.9;
    expect(s.sigmaEffective / s.sigma).toBeCloseTo(Math.sqrt((1 + phi) / (1 - phi)), 12);
    expect(() => estimateChartSigma([1, 1, 1], 0.1)).toThrow(RangeError);
  });
});
