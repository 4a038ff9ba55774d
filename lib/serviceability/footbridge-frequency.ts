/**
 * Footbridge natural frequencies against pedestrian-comfort criteria (pure, no I/O).
 *
 * Two kinds of rule, each value with its source beside it:
 * - EN 1990 Annex A2, A2.4.3.2 [pub]: a comfort check is needed when the fundamental vertical
 *   frequency is below 5 Hz, or a horizontal (lateral) or torsional one below 2.5 Hz.
 * - Resonance-risk ranges widely used in European footbridge guidance (e.g. the Sétra
 *   footbridge guide, 2006, and HiVoSS, 2008) [pub, from memory: verify the clause before
 *   quoting]: vertical 1.25–2.3 Hz (walking), 2.5–4.6 Hz (second harmonic of walking);
 *   lateral 0.5–1.2 Hz.
 * National annexes may differ: every value can be overridden (organisation overrides).
 */

export type ModeDirection = "vertical" | "lateral" | "torsional";

export interface FootbridgeFrequencyValues {
  /** EN 1990 A2.4.3.2 [pub]: vertical comfort-check threshold, Hz. */
  comfortCheckVerticalHz: number;
  /** EN 1990 A2.4.3.2 [pub]: horizontal and torsional comfort-check threshold, Hz. */
  comfortCheckHorizontalHz: number;
  /** Footbridge guidance [pub, from memory]: vertical resonance range (walking pace), Hz. */
  verticalRiskHz: [number, number];
  /** Footbridge guidance [pub, from memory]: vertical range of the second walking harmonic, Hz. */
  verticalSecondHarmonicHz: [number, number];
  /** Footbridge guidance [pub, from memory]: lateral (and torsional) resonance range, Hz. */
  lateralRiskHz: [number, number];
}

export const FOOTBRIDGE_FREQUENCY_DEFAULTS: FootbridgeFrequencyValues = {
  comfortCheckVerticalHz: 5, // EN 1990 Annex A2, A2.4.3.2 [pub]
  comfortCheckHorizontalHz: 2.5, // EN 1990 Annex A2, A2.4.3.2 [pub]
  verticalRiskHz: [1.25, 2.3], // European footbridge guidance [pub, from memory]
  verticalSecondHarmonicHz: [2.5, 4.6], // European footbridge guidance [pub, from memory]
  lateralRiskHz: [0.5, 1.2], // European footbridge guidance [pub, from memory]
};

/** Where each value comes from, for display beside it. */
export const FOOTBRIDGE_FREQUENCY_SOURCES: Record<keyof FootbridgeFrequencyValues, string> = {
  comfortCheckVerticalHz: "EN 1990 Annex A2, A2.4.3.2",
  comfortCheckHorizontalHz: "EN 1990 Annex A2, A2.4.3.2",
  verticalRiskHz: "European footbridge guidance (from memory; verify)",
  verticalSecondHarmonicHz: "European footbridge guidance, 2nd walking harmonic (from memory; verify)",
  lateralRiskHz: "European footbridge guidance (from memory; verify)",
};

/** `high`: inside the main walking range; `second_harmonic`: inside the 2nd-harmonic range; `outside`: neither. */
export type ResonanceRisk = "high" | "second_harmonic" | "outside";

export interface FootbridgeFrequencyCheck {
  direction: ModeDirection;
  frequencyHz: number;
  /** True when the frequency is below the EN 1990 threshold for its direction. */
  comfortCheckNeeded: boolean;
  thresholdHz: number;
  risk: ResonanceRisk;
  /** The range the frequency lies in, or null. */
  rangeHz: [number, number] | null;
}

const inside = (f: number, [lo, hi]: [number, number]) => f >= lo && f <= hi;

/**
 * Checks one footbridge mode against the comfort threshold and the resonance ranges.
 *
 * @param frequencyHz - natural frequency, Hz, finite and > 0.
 * @param direction - vertical, lateral or torsional (torsional uses the horizontal threshold
 *   and the lateral range, as EN 1990 groups them; [practice] for the range).
 * @param values - thresholds; defaults to {@link FOOTBRIDGE_FREQUENCY_DEFAULTS}.
 * @throws TypeError for a non-finite frequency; RangeError for a frequency ≤ 0.
 */
export function checkFootbridgeFrequency(
  frequencyHz: number, direction: ModeDirection, values: FootbridgeFrequencyValues = FOOTBRIDGE_FREQUENCY_DEFAULTS,
): FootbridgeFrequencyCheck {
  if (typeof frequencyHz !== "number" || !Number.isFinite(frequencyHz)) throw new TypeError(`frequencyHz must be a finite number (got ${frequencyHz})`);
  if (frequencyHz <= 0) throw new RangeError(`frequencyHz must be > 0 (got ${frequencyHz})`);
  const thresholdHz = direction === "vertical" ? values.comfortCheckVerticalHz : values.comfortCheckHorizontalHz;
  let risk: ResonanceRisk = "outside";
  let rangeHz: [number, number] | null = null;
  if (direction === "vertical") {
    if (inside(frequencyHz, values.verticalRiskHz)) [risk, rangeHz] = ["high", values.verticalRiskHz];
    else if (inside(frequencyHz, values.verticalSecondHarmonicHz)) [risk, rangeHz] = ["second_harmonic", values.verticalSecondHarmonicHz];
  } else if (inside(frequencyHz, values.lateralRiskHz)) {
    [risk, rangeHz] = ["high", values.lateralRiskHz];
  }
  return { direction, frequencyHz, comfortCheckNeeded: frequencyHz < thresholdHz, thresholdHz, risk, rangeHz };
}
