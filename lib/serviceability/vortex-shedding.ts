/**
 * Vortex shedding on towers, masts and chimneys (pure, no I/O).
 *
 * Critical wind speed v_crit = b·n/St [pub: EN 1991-1-4 Annex E, E.1.3.1], with b the
 * cross-wind section width (m), n the natural frequency of the cross-wind mode (Hz) and St
 * the Strouhal number (0.18 for circular sections, Annex E Table E.1 [pub]).
 * A record is a lock-in candidate when its reported wind speed lies within a band around
 * v_crit (±20 % by default [practice]) and its horizontal response is narrow-band: a crest
 * factor (peak / RMS) near that of a sine (√2) rather than of Gaussian random vibration
 * (≈ 3.5–4.5 over a 10-minute record [pub: Davenport 1964 peak factor]); the default limit
 * of 2.0 is [practice].
 */

export interface VortexSheddingValues {
  /** Strouhal number (EN 1991-1-4 Annex E, Table E.1: 0.18 for circular sections) [pub]. */
  strouhal: number;
  /** Half-width of the wind band around v_crit, as a fraction of v_crit [practice]. */
  lockInBandFraction: number;
  /** Largest crest factor (peak/RMS) still read as narrow-band [practice]. */
  narrowBandMaxCrest: number;
}

export const VORTEX_SHEDDING_DEFAULTS: VortexSheddingValues = {
  strouhal: 0.18, // EN 1991-1-4 Annex E, Table E.1 [pub]
  lockInBandFraction: 0.2, // [practice]
  narrowBandMaxCrest: 2.0, // [practice]: a sine has √2, Gaussian noise ≈ 3.5–4.5
};

export const VORTEX_SHEDDING_SOURCES: Record<keyof VortexSheddingValues, string> = {
  strouhal: "EN 1991-1-4 Annex E, Table E.1 (circular section)",
  lockInBandFraction: "Common practice",
  narrowBandMaxCrest: "Common practice (sine √2, random ≈ 3.5–4.5)",
};

/**
 * Critical vortex-shedding wind speed v_crit = b·n/St, m/s.
 * @param sectionWidthM - b, m, finite > 0.
 * @param frequencyHz - n, Hz, finite > 0.
 * @param strouhal - St, finite > 0 (default 0.18).
 * @throws TypeError for non-finite input; RangeError for a value ≤ 0.
 */
export function criticalWindSpeed(sectionWidthM: number, frequencyHz: number, strouhal = VORTEX_SHEDDING_DEFAULTS.strouhal): number {
  for (const [name, v] of [["sectionWidthM", sectionWidthM], ["frequencyHz", frequencyHz], ["strouhal", strouhal]] as const) {
    if (typeof v !== "number" || !Number.isFinite(v)) throw new TypeError(`${name} must be a finite number (got ${v})`);
    if (v <= 0) throw new RangeError(`${name} must be > 0 (got ${v})`);
  }
  return (sectionWidthM * frequencyHz) / strouhal;
}

export type LockInClass = "lock_in_candidate" | "in_band_broadband" | "in_band_unknown_response" | "outside_band";

/**
 * Classifies one record: its wind speed against v_crit, and its response crest factor.
 * @param windSpeedMps - the record's reported wind speed, m/s, finite ≥ 0.
 * @param vCritMps - critical wind speed, m/s, > 0.
 * @param crestFactor - peak/RMS of the horizontal response, or null when unknown.
 */
export function classifyLockIn(
  windSpeedMps: number, vCritMps: number, crestFactor: number | null, values: VortexSheddingValues = VORTEX_SHEDDING_DEFAULTS,
): LockInClass {
  if (!Number.isFinite(windSpeedMps) || !Number.isFinite(vCritMps)) throw new TypeError("wind speeds must be finite");
  if (windSpeedMps < 0 || vCritMps <= 0) throw new RangeError(`wind speed must be ≥ 0 and v_crit > 0 (got ${windSpeedMps}, ${vCritMps})`);
  const inBand = Math.abs(windSpeedMps - vCritMps) <= values.lockInBandFraction * vCritMps;
  if (!inBand) return "outside_band";
  if (crestFactor === null || !Number.isFinite(crestFactor)) return "in_band_unknown_response";
  return crestFactor <= values.narrowBandMaxCrest ? "lock_in_candidate" : "in_band_broadband";
}
