/**
 * Footbridge deck accelerations against the recommended comfort maxima (pure, no I/O).
 * EN 1990 Annex A2, A2.4.3.2 [pub]: recommended maximum deck acceleration 0.7 m/s² vertical,
 * 0.2 m/s² horizontal for normal use, 0.4 m/s² horizontal for exceptional crowd conditions.
 * The code applies them to design (predicted) responses; comparing measured ambient
 * responses with them is an indication, not a code verification. National annexes may differ.
 */

export interface FootbridgeAccelerationValues {
  /** EN 1990 A2.4.3.2 [pub]: vertical, m/s². */
  maxVerticalMps2: number;
  /** EN 1990 A2.4.3.2 [pub]: horizontal, normal use, m/s². */
  maxHorizontalMps2: number;
  /** EN 1990 A2.4.3.2 [pub]: horizontal, exceptional crowd conditions, m/s². */
  maxHorizontalCrowdMps2: number;
}

export const FOOTBRIDGE_ACCELERATION_DEFAULTS: FootbridgeAccelerationValues = {
  maxVerticalMps2: 0.7, // EN 1990 Annex A2, A2.4.3.2 [pub]
  maxHorizontalMps2: 0.2, // EN 1990 Annex A2, A2.4.3.2 [pub]
  maxHorizontalCrowdMps2: 0.4, // EN 1990 Annex A2, A2.4.3.2 [pub]
};

export const FOOTBRIDGE_ACCELERATION_SOURCES: Record<keyof FootbridgeAccelerationValues, string> = {
  maxVerticalMps2: "EN 1990 Annex A2, A2.4.3.2 (recommended)",
  maxHorizontalMps2: "EN 1990 Annex A2, A2.4.3.2 (recommended, normal use)",
  maxHorizontalCrowdMps2: "EN 1990 Annex A2, A2.4.3.2 (recommended, crowd)",
};

export type AccelerationAxis = "vertical" | "horizontal";

export interface AccelerationCheck {
  axis: AccelerationAxis;
  valueMps2: number;
  limitMps2: number;
  /** value / limit. */
  utilisation: number;
  exceeds: boolean;
  /** Horizontal only: above the crowd limit too. */
  exceedsCrowd: boolean | null;
}

/**
 * Compares one acceleration (peak or 1-s RMS, m/s²) with the recommended maximum of its axis.
 *
 * @param valueMps2 - acceleration, m/s², finite and ≥ 0.
 * @param axis - vertical or horizontal.
 * @param values - limits; defaults to {@link FOOTBRIDGE_ACCELERATION_DEFAULTS}.
 * @throws TypeError for a non-finite value; RangeError for a negative one.
 */
export function checkFootbridgeAcceleration(
  valueMps2: number, axis: AccelerationAxis, values: FootbridgeAccelerationValues = FOOTBRIDGE_ACCELERATION_DEFAULTS,
): AccelerationCheck {
  if (typeof valueMps2 !== "number" || !Number.isFinite(valueMps2)) throw new TypeError(`valueMps2 must be a finite number (got ${valueMps2})`);
  if (valueMps2 < 0) throw new RangeError(`valueMps2 must be ≥ 0 (got ${valueMps2})`);
  const limitMps2 = axis === "vertical" ? values.maxVerticalMps2 : values.maxHorizontalMps2;
  return {
    axis, valueMps2, limitMps2, utilisation: valueMps2 / limitMps2, exceeds: valueMps2 > limitMps2,
    exceedsCrowd: axis === "horizontal" ? valueMps2 > values.maxHorizontalCrowdMps2 : null,
  };
}
