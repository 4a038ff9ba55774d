/**
 * The serviceability values as one flat, overridable table (a national annex or an owner's
 * procedure may set other values): key → default, unit and source. An organisation's
 * overrides replace single keys; {@link mergeServiceabilityValues} builds the typed objects
 * the rules take. Pure, no I/O.
 */
import { FOOTBRIDGE_ACCELERATION_DEFAULTS, FOOTBRIDGE_ACCELERATION_SOURCES, type FootbridgeAccelerationValues } from "./footbridge-acceleration";
import { FOOTBRIDGE_FREQUENCY_DEFAULTS, FOOTBRIDGE_FREQUENCY_SOURCES, type FootbridgeFrequencyValues } from "./footbridge-frequency";
import { VORTEX_SHEDDING_DEFAULTS, VORTEX_SHEDDING_SOURCES, type VortexSheddingValues } from "./vortex-shedding";

export interface ServiceabilityValueSpec { key: string; label: string; unit: string; defaultValue: number; source: string }

const F = FOOTBRIDGE_FREQUENCY_DEFAULTS, FS = FOOTBRIDGE_FREQUENCY_SOURCES;
const A = FOOTBRIDGE_ACCELERATION_DEFAULTS, AS = FOOTBRIDGE_ACCELERATION_SOURCES;
const V = VORTEX_SHEDDING_DEFAULTS, VS = VORTEX_SHEDDING_SOURCES;

export const SERVICEABILITY_VALUE_SPECS: readonly ServiceabilityValueSpec[] = [
  { key: "footbridge.comfort_check_vertical_hz", label: "Comfort check below (vertical)", unit: "Hz", defaultValue: F.comfortCheckVerticalHz, source: FS.comfortCheckVerticalHz },
  { key: "footbridge.comfort_check_horizontal_hz", label: "Comfort check below (horizontal, torsional)", unit: "Hz", defaultValue: F.comfortCheckHorizontalHz, source: FS.comfortCheckHorizontalHz },
  { key: "footbridge.vertical_risk_low_hz", label: "Vertical resonance range, low", unit: "Hz", defaultValue: F.verticalRiskHz[0], source: FS.verticalRiskHz },
  { key: "footbridge.vertical_risk_high_hz", label: "Vertical resonance range, high", unit: "Hz", defaultValue: F.verticalRiskHz[1], source: FS.verticalRiskHz },
  { key: "footbridge.vertical_h2_low_hz", label: "Vertical 2nd-harmonic range, low", unit: "Hz", defaultValue: F.verticalSecondHarmonicHz[0], source: FS.verticalSecondHarmonicHz },
  { key: "footbridge.vertical_h2_high_hz", label: "Vertical 2nd-harmonic range, high", unit: "Hz", defaultValue: F.verticalSecondHarmonicHz[1], source: FS.verticalSecondHarmonicHz },
  { key: "footbridge.lateral_risk_low_hz", label: "Lateral resonance range, low", unit: "Hz", defaultValue: F.lateralRiskHz[0], source: FS.lateralRiskHz },
  { key: "footbridge.lateral_risk_high_hz", label: "Lateral resonance range, high", unit: "Hz", defaultValue: F.lateralRiskHz[1], source: FS.lateralRiskHz },
  { key: "footbridge.max_vertical_mps2", label: "Maximum deck acceleration, vertical", unit: "m/s²", defaultValue: A.maxVerticalMps2, source: AS.maxVerticalMps2 },
  { key: "footbridge.max_horizontal_mps2", label: "Maximum deck acceleration, horizontal (normal use)", unit: "m/s²", defaultValue: A.maxHorizontalMps2, source: AS.maxHorizontalMps2 },
  { key: "footbridge.max_horizontal_crowd_mps2", label: "Maximum deck acceleration, horizontal (crowd)", unit: "m/s²", defaultValue: A.maxHorizontalCrowdMps2, source: AS.maxHorizontalCrowdMps2 },
  { key: "vortex.strouhal", label: "Strouhal number", unit: "–", defaultValue: V.strouhal, source: VS.strouhal },
  { key: "vortex.lock_in_band_fraction", label: "Wind band around v_crit (±fraction)", unit: "–", defaultValue: V.lockInBandFraction, source: VS.lockInBandFraction },
  { key: "vortex.narrow_band_max_crest", label: "Narrow-band response: crest factor at most", unit: "–", defaultValue: V.narrowBandMaxCrest, source: VS.narrowBandMaxCrest },
];

export const SERVICEABILITY_KEYS: ReadonlySet<string> = new Set(SERVICEABILITY_VALUE_SPECS.map((s) => s.key));

export interface ServiceabilityValues {
  frequency: FootbridgeFrequencyValues;
  acceleration: FootbridgeAccelerationValues;
  vortex: VortexSheddingValues;
  /** Per key: the value in force and whether an override set it. */
  table: { spec: ServiceabilityValueSpec; value: number; overridden: boolean; note: string | null }[];
}

/**
 * Defaults with `overrides` applied (unknown keys and non-finite values are ignored).
 * @param overrides - key → { value, note } from the organisation's overrides.
 */
export function mergeServiceabilityValues(overrides: Record<string, { value: number; note: string | null }> = {}): ServiceabilityValues {
  const table = SERVICEABILITY_VALUE_SPECS.map((spec) => {
    const o = overrides[spec.key];
    const ok = o !== undefined && Number.isFinite(o.value);
    return { spec, value: ok ? o.value : spec.defaultValue, overridden: ok, note: ok ? o.note : null };
  });
  const v = (key: string) => table.find((t) => t.spec.key === key)?.value ?? Number.NaN;
  return {
    frequency: {
      comfortCheckVerticalHz: v("footbridge.comfort_check_vertical_hz"),
      comfortCheckHorizontalHz: v("footbridge.comfort_check_horizontal_hz"),
      verticalRiskHz: [v("footbridge.vertical_risk_low_hz"), v("footbridge.vertical_risk_high_hz")],
      verticalSecondHarmonicHz: [v("footbridge.vertical_h2_low_hz"), v("footbridge.vertical_h2_high_hz")],
      lateralRiskHz: [v("footbridge.lateral_risk_low_hz"), v("footbridge.lateral_risk_high_hz")],
    },
    acceleration: {
      maxVerticalMps2: v("footbridge.max_vertical_mps2"),
      maxHorizontalMps2: v("footbridge.max_horizontal_mps2"),
      maxHorizontalCrowdMps2: v("footbridge.max_horizontal_crowd_mps2"),
    },
    vortex: {
      strouhal: v("vortex.strouhal"),
      lockInBandFraction: v("vortex.lock_in_band_fraction"),
      narrowBandMaxCrest: v("vortex.narrow_band_max_crest"),
    },
    table,
  };
}
