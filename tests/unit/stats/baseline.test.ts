/**
 * Baseline models of frequency against temperature [pub: Peeters & De Roeck 2001].
 */
import { describe, expect, it } from "vitest";
import { fitBaseline } from "@/lib/stats/baseline-fit";
import { predictBaseline, predictBaselineSeries } from "@/lib/stats/baseline-predict";
import { laggedTemperature } from "@/lib/stats/lagged-temperature";
import { createRng } from "@/lib/simulate/rng";
import { frequencyAtTemperature } from "@/lib/simulate/temperature";

const DAY = 86_400_000;

function simulated(seed: number, n: number, spanDays: number) {
  const rng = createRng(seed);
  const timesMs = Float64Array.from({ length: n }, (_, i) => (i * spanDays * DAY) / n);
  const temperatureC = Float64Array.from({ length: n }, () => -12 + 35 * rng.next());
  const frequencyHz = Float64Array.from(temperatureC, (t) =>
    frequencyAtTemperature(3, t, { slopePerC: -0.002, knotC: 0, coldSlopePerC: -0.01 }) * (1 + 0.002 * rng.normal()));
  return { timesMs, temperatureC, frequencyHz };
}

describe("fitBaseline", () => {
  it("recovers a knot at 0 °C within 0.5 °C on simulated bilinear data and chooses it by BIC", () => {
    // Issue 5 check; simulated with lib/simulate frequencyAtTemperature (knot 0 °C)
    const m = fitBaseline(simulated(1, 600, 400));
    expect(m.kind).toBe("bilinear");
    expect(Math.abs(m.knotC ?? Infinity)).toBeLessThan(0.5);
    // slopes: 3 Hz × −0.2 %/°C above, 3 Hz × −1 %/°C below [analytic, from the simulation]
    expect(m.slopeHzPerC).toBeCloseTo(-0.006, 3);
    expect(m.coldSlopeHzPerC ?? 0).toBeCloseTo(-0.03, 2);
    expect(m.residualStdHz).toBeGreaterThan(0.6 * 0.006);
    expect(m.residualStdHz).toBeLessThan(1.4 * 0.006);
    expect(m.status).toBe("complete");
  });

  it("is continuous at the knot", () => {
    const m = fitBaseline(simulated(2, 400, 400), { model: "bilinear" });
    const k = m.knotC ?? 0;
    const eps = 1e-7;
    expect(Math.abs(predictBaseline(m, k - eps).frequencyHz - predictBaseline(m, k + eps).frequencyHz)).toBeLessThan(1e-8);
  });

  it("prefers the linear model on linear data and is provisional on a short window", () => {
    const rng = createRng(3);
    const n = 200;
    const temperatureC = Float64Array.from({ length: n }, () => -10 + 30 * rng.next());
    const data = {
      timesMs: Float64Array.from({ length: n }, (_, i) => i * 3_600_000),
      temperatureC,
      frequencyHz: Float64Array.from(temperatureC, (t) => 5 - 0.01 * t + 0.005 * rng.normal()),
    };
    const m = fitBaseline(data);
    expect(m.kind).toBe("linear");
    expect(m.status).toBe("provisional");
    expect(m.candidates.map((c) => c.kind).sort()).toEqual(["bilinear", "linear"]);
  });

  it("flags predictions outside the training temperature envelope", () => {
    const m = fitBaseline(simulated(4, 300, 400));
    const [lo, hi] = m.envelope.temperatureC;
    expect(predictBaseline(m, (lo + hi) / 2).outOfEnvelope).toBe(false);
    expect(predictBaseline(m, hi + 1).outOfEnvelope).toBe(true);
    expect(predictBaseline(m, lo - 1).outOfEnvelope).toBe(true);
  });

  it("fits an extra covariate and uses the lagged temperature in series predictions", () => {
    const rng = createRng(5);
    const n = 500;
    const timesMs = Float64Array.from({ length: n }, (_, i) => i * 3_600_000);
    const temperatureC = Float64Array.from({ length: n }, (_, i) => 10 + 8 * Math.sin(i / 20));
    const humidity = Float64Array.from({ length: n }, () => 40 + 50 * rng.next());
    const lag = laggedTemperature(timesMs, temperatureC, 12);
    const frequencyHz = Float64Array.from(lag, (t, i) => 4 - 0.008 * t - 0.001 * humidity[i] + 1e-4 * rng.normal());
    const m = fitBaseline({ timesMs, temperatureC, frequencyHz, covariates: { humidityPct: humidity } }, { model: "linear", lagHours: 12 });
    expect(m.covariateCoefficients[0]).toBeCloseTo(-0.001, 4);
    expect(m.slopeHzPerC).toBeCloseTo(-0.008, 4);
    const p = predictBaselineSeries(m, { timesMs, temperatureC, covariates: { humidityPct: humidity } });
    expect(Math.abs(p.frequencyHz[300] - frequencyHz[300])).toBeLessThan(5e-4);
  });

  it("rejects unequal lengths, decreasing times and an impossible bilinear request", () => {
    const d = simulated(6, 50, 10);
    expect(() => fitBaseline({ ...d, frequencyHz: d.frequencyHz.subarray(1) })).toThrow(RangeError);
    expect(() => fitBaseline({ ...d, timesMs: Float64Array.from(d.timesMs).reverse() })).toThrow(RangeError);
    const warm = { ...d, temperatureC: Float64Array.from(d.temperatureC, (t) => Math.abs(t) + 10) };
    expect(() => fitBaseline(warm, { model: "bilinear" })).toThrow(RangeError);
    expect(() => fitBaseline({ ...d, temperatureC: Float64Array.from(d.temperatureC, () => Number.NaN) })).toThrow(TypeError);
  });
});
