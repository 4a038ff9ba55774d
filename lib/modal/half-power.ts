/**
 * Half-power bandwidth damping on a power spectrum [Chopra, Dynamics of Structures, ch. 3]:
 * the points where the spectrum falls to half its peak (peak/√2 on an amplitude spectrum),
 * ζ ≈ (f₂ − f₁)/(2f_n), Q = 1/(2ζ), η = 2ζ. Crossings are linearly interpolated between
 * lines. With the half-power bandwidth below ~1.5 line spacings the estimate reads high
 * (the peak is smeared by the window); the bandwidth in lines is returned so the caller can
 * flag it (REFERENCES.md, known biases).
 */
import { assertInteger, assertNumberArray, assertPositive } from "@/lib/numeric/validate";

export interface HalfPowerResult {
  /** Lower and upper half-power frequencies, Hz. */
  lowerHz: number;
  upperHz: number;
  /** Peak frequency used for ζ, Hz (parabolic vertex of log power). */
  peakHz: number;
  dampingRatio: number;
  q: number;
  lossFactor: number;
  /** (f₂ − f₁)/Δf: the half-power bandwidth in line spacings. */
  bandwidthLines: number;
}

/**
 * Half-power bandwidth damping of the peak at `peakLine` of a power spectrum.
 *
 * @param power - one-sided power spectrum (any positive unit), line k at k·Δf, length ≥ 3, finite ≥ 0.
 * @param lineSpacingHz - Δf in Hz, > 0.
 * @param peakLine - index of a local maximum, 1 … length−2.
 * @returns the crossing frequencies, ζ, Q and η, or null when the spectrum does not fall to
 *   half the peak on both sides before reaching a higher value (the peak is not isolated).
 * @throws TypeError for non-numeric input; RangeError for a bad index or spacing.
 */
export function halfPowerDamping(power: ArrayLike<number>, lineSpacingHz: number, peakLine: number): HalfPowerResult | null {
  assertNumberArray(power, "power", 3);
  assertPositive(lineSpacingHz, "lineSpacingHz");
  assertInteger(peakLine, "peakLine", 1, power.length - 2);
  const k = peakLine;
  const a = power[k - 1], b = power[k], c = power[k + 1];
  if (!(b > 0)) return null;
  // Peak height and position from a parabola through the three top lines (in linear power);
  // taking the top line alone biases the bandwidth with the line's offset from the true peak.
  const den = a - 2 * b + c;
  const off = den < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den)) : 0;
  const peak = den < 0 ? b - 0.25 * (a - c) * off : b;
  const half = peak / 2;
  let i = k;
  while (i > 0 && power[i - 1] >= half) {
    if (power[i - 1] > peak) return null; // a higher peak before the half-power point
    i--;
  }
  if (i === 0) return null;
  const lower = i - 1 + (half - power[i - 1]) / (power[i] - power[i - 1]);
  let j = k;
  while (j < power.length - 1 && power[j + 1] >= half) {
    if (power[j + 1] > peak) return null;
    j++;
  }
  if (j === power.length - 1) return null;
  const upper = j + (power[j] - half) / (power[j] - power[j + 1]);
  const peakHz = (k + off) * lineSpacingHz;
  const lowerHz = lower * lineSpacingHz;
  const upperHz = upper * lineSpacingHz;
  const zeta = (upperHz - lowerHz) / (2 * peakHz);
  return { lowerHz, upperHz, peakHz, dampingRatio: zeta, q: 1 / (2 * zeta), lossFactor: 2 * zeta, bandwidthLines: upper - lower };
}
