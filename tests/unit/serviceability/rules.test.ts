import { describe, expect, it } from "vitest";
import { checkFootbridgeFrequency, FOOTBRIDGE_FREQUENCY_DEFAULTS } from "@/lib/serviceability/footbridge-frequency";
import { checkFootbridgeAcceleration, FOOTBRIDGE_ACCELERATION_DEFAULTS } from "@/lib/serviceability/footbridge-acceleration";
import {
  compareDamping, dampingRatioFromLogDecrement, FOOTBRIDGE_DAMPING_MATERIALS, guessFootbridgeMaterial, guessTowerDampingType,
  logDecrementFromDampingRatio, TOWER_DAMPING_TYPES,
} from "@/lib/serviceability/damping-guidance";
import { classifyLockIn, criticalWindSpeed, VORTEX_SHEDDING_DEFAULTS } from "@/lib/serviceability/vortex-shedding";
import { mergeServiceabilityValues } from "@/lib/serviceability/values";
import { directionFromLabel, directionFromShape } from "@/lib/serviceability/direction";

describe("footbridge frequency rules", () => {
  it("holds the EN 1990 Annex A2 and footbridge-guidance values", () => {
    // EN 1990 Annex A2, A2.4.3.2 [pub]: 5 Hz vertical, 2.5 Hz horizontal/torsional.
    expect(FOOTBRIDGE_FREQUENCY_DEFAULTS.comfortCheckVerticalHz).toBe(5);
    expect(FOOTBRIDGE_FREQUENCY_DEFAULTS.comfortCheckHorizontalHz).toBe(2.5);
    // European footbridge guidance [pub, from memory] (REFERENCES.md §Serviceability).
    expect(FOOTBRIDGE_FREQUENCY_DEFAULTS.verticalRiskHz).toEqual([1.25, 2.3]);
    expect(FOOTBRIDGE_FREQUENCY_DEFAULTS.verticalSecondHarmonicHz).toEqual([2.5, 4.6]);
    expect(FOOTBRIDGE_FREQUENCY_DEFAULTS.lateralRiskHz).toEqual([0.5, 1.2]);
  });

  it("puts a 1.9 Hz vertical mode in the high-risk range (1.25–2.3 Hz) with a comfort check needed", () => {
    const c = checkFootbridgeFrequency(1.9, "vertical");
    expect(c.risk).toBe("high");
    expect(c.rangeHz).toEqual([1.25, 2.3]);
    expect(c.comfortCheckNeeded).toBe(true);
  });

  it("needs no comfort check for a 6 Hz vertical mode (≥ 5 Hz, EN 1990 A2.4.3.2)", () => {
    const c = checkFootbridgeFrequency(6, "vertical");
    expect(c.comfortCheckNeeded).toBe(false);
    expect(c.risk).toBe("outside");
  });

  it("flags a 3.12 Hz vertical mode in the second-harmonic range (2.5–4.6 Hz)", () => {
    expect(checkFootbridgeFrequency(3.12, "vertical").risk).toBe("second_harmonic");
  });

  it("applies the 2.5 Hz threshold and the 0.5–1.2 Hz range to lateral and torsional modes", () => {
    expect(checkFootbridgeFrequency(1.0, "lateral")).toMatchObject({ risk: "high", comfortCheckNeeded: true, thresholdHz: 2.5 });
    expect(checkFootbridgeFrequency(2.0, "torsional")).toMatchObject({ risk: "outside", comfortCheckNeeded: true });
    expect(checkFootbridgeFrequency(3.0, "lateral").comfortCheckNeeded).toBe(false);
    // 1.9 Hz lateral is outside the lateral range even though it is in the vertical one.
    expect(checkFootbridgeFrequency(1.9, "lateral").risk).toBe("outside");
  });

  it("rejects non-finite and non-positive frequencies", () => {
    expect(() => checkFootbridgeFrequency(Number.NaN, "vertical")).toThrow(TypeError);
    expect(() => checkFootbridgeFrequency(0, "vertical")).toThrow(RangeError);
  });
});

describe("footbridge acceleration rules", () => {
  it("holds the EN 1990 A2.4.3.2 recommended maxima 0.7 / 0.2 / 0.4 m/s²", () => {
    expect(FOOTBRIDGE_ACCELERATION_DEFAULTS).toEqual({ maxVerticalMps2: 0.7, maxHorizontalMps2: 0.2, maxHorizontalCrowdMps2: 0.4 });
  });

  it("compares vertical with 0.7 and horizontal with 0.2 (crowd 0.4) m/s²", () => {
    expect(checkFootbridgeAcceleration(0.8, "vertical")).toMatchObject({ exceeds: true, exceedsCrowd: null });
    expect(checkFootbridgeAcceleration(0.35, "vertical").utilisation).toBeCloseTo(0.5, 12); // 0.35/0.7
    expect(checkFootbridgeAcceleration(0.3, "horizontal")).toMatchObject({ exceeds: true, exceedsCrowd: false });
    expect(checkFootbridgeAcceleration(0.5, "horizontal").exceedsCrowd).toBe(true);
    expect(() => checkFootbridgeAcceleration(-0.1, "vertical")).toThrow(RangeError);
  });
});

describe("damping guidance", () => {
  const delta = (key: string) => TOWER_DAMPING_TYPES.find((t) => t.key === key)?.logDecrement;

  it("holds EN 1991-1-4 Table F.2 log decrements [pub, from memory]", () => {
    expect(delta("welded_steel_chimney")).toBe(0.012);
    expect(delta("rc_tower_chimney")).toBe(0.03);
    expect(delta("lattice_welded")).toBe(0.02);
    expect(delta("lattice_hs_bolted")).toBe(0.03);
  });

  it("converts ζ ↔ δ with δ = 2πζ/√(1−ζ²) (≈ 2πζ for light damping) [pub: Chopra §2.2.4]", () => {
    expect(logDecrementFromDampingRatio(0.01)).toBeCloseTo(2 * Math.PI * 0.01, 5); // 0.06283; the exact term differs by 3e-6
    expect(dampingRatioFromLogDecrement(0.02)).toBeCloseTo(0.02 / (2 * Math.PI), 6); // 0.003183
    expect(dampingRatioFromLogDecrement(logDecrementFromDampingRatio(0.05))).toBeCloseTo(0.05, 12);
    expect(() => logDecrementFromDampingRatio(1)).toThrow(RangeError);
  });

  it("keeps each footbridge material's minimum below its mean, and classifies measured damping", () => {
    for (const m of FOOTBRIDGE_DAMPING_MATERIALS) expect(m.minimumRatio).toBeLessThan(m.meanRatio);
    expect(compareDamping(0.001, 0.002, 0.004)).toBe("below_guidance");
    expect(compareDamping(0.003, 0.002, 0.004)).toBe("within_guidance");
    expect(compareDamping(0.012, 0.002, 0.004)).toBe("above_guidance");
  });

  it("guesses the guidance row from material words [practice]", () => {
    expect(guessFootbridgeMaterial("Glued-laminated timber")).toBe("timber");
    expect(guessFootbridgeMaterial("Steel truss")).toBe("steel");
    expect(guessTowerDampingType("mast", "Galvanised steel lattice")).toBe("lattice_hs_bolted");
    expect(guessTowerDampingType("tower", "Steel tube")).toBe("welded_steel_chimney");
  });
});

describe("vortex shedding", () => {
  it("uses St = 0.18 (EN 1991-1-4 Annex E, circular section)", () => {
    expect(VORTEX_SHEDDING_DEFAULTS.strouhal).toBe(0.18);
  });

  it("gives v_crit = b·n/St = 0.8 × 0.85 / 0.18 = 3.78 m/s", () => {
    expect(criticalWindSpeed(0.8, 0.85, 0.18)).toBeCloseTo(3.78, 2);
    // St is editable: 0.2 gives 3.4 m/s.
    expect(criticalWindSpeed(0.8, 0.85, 0.2)).toBeCloseTo(3.4, 10);
    expect(() => criticalWindSpeed(0, 0.85)).toThrow(RangeError);
  });

  it("calls a record a lock-in candidate only with wind in the band and a narrow-band response", () => {
    const v = criticalWindSpeed(0.8, 0.85); // 3.78 m/s; band ±20 % = 3.02–4.53 m/s
    expect(classifyLockIn(3.9, v, Math.SQRT2)).toBe("lock_in_candidate"); // a sine's crest factor
    expect(classifyLockIn(3.9, v, 3.8)).toBe("in_band_broadband"); // Gaussian-like
    expect(classifyLockIn(3.9, v, null)).toBe("in_band_unknown_response");
    expect(classifyLockIn(6, v, Math.SQRT2)).toBe("outside_band");
    expect(classifyLockIn(4.4, v, 1.5)).toBe("lock_in_candidate");
    expect(classifyLockIn(4.6, v, 1.5)).toBe("outside_band");
  });
});

describe("overridable values", () => {
  it("answers the defaults without overrides, and replaces single keys with an override", () => {
    expect(mergeServiceabilityValues().frequency).toEqual(FOOTBRIDGE_FREQUENCY_DEFAULTS);
    const merged = mergeServiceabilityValues({ "footbridge.comfort_check_vertical_hz": { value: 4.5, note: "national annex" } });
    expect(merged.frequency.comfortCheckVerticalHz).toBe(4.5);
    expect(checkFootbridgeFrequency(4.8, "vertical", merged.frequency).comfortCheckNeeded).toBe(false);
    expect(merged.table.find((t) => t.spec.key === "footbridge.comfort_check_vertical_hz")).toMatchObject({ overridden: true, note: "national annex" });
    expect(merged.acceleration).toEqual(FOOTBRIDGE_ACCELERATION_DEFAULTS);
  });
});

describe("mode direction", () => {
  it("reads direction words in labels, else where the shape is largest", () => {
    expect(directionFromLabel("1st vertical bending")).toBe("vertical");
    expect(directionFromLabel("1st lateral")).toBe("lateral");
    expect(directionFromLabel("1st torsion")).toBe("torsional");
    expect(directionFromLabel("1st bending (x)")).toBeNull();
    expect(directionFromShape({ A1: 0.2, A5: 1 }, { A1: "z", A5: "y" })).toBe("lateral");
    expect(directionFromShape({ A1: 1, A5: 0.1 }, { A1: "-z", A5: "y" })).toBe("vertical");
    expect(directionFromShape(null, {})).toBeNull();
  });
});
