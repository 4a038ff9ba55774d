/**
 * Automatic Welch segment length for damping estimation [practice].
 *
 * Spectral damping (half-power, EFDD) needs the half-power bandwidth B_r = 2ζf of the
 * lowest mode to span several lines: below ~1.5 lines it reads high by +50 % to +300 %
 * (REFERENCES.md, known biases). The random error of each spectral line is ≈ 1/√n_d for n_d
 * averages [Bendat & Piersol §8.5], so ≥ 20 averages are kept. When both cannot hold, the
 * averages win and a warning says damping is not trustworthy. A record should also span
 * 1000–2000 periods of the lowest mode [Cantieni 2005, 1st IOMAC].
 */
import { assertInteger, assertInRange, assertPositive } from "@/lib/numeric/validate";

export interface SegmentLengthOptions {
  /** Lowest natural frequency of interest in Hz, > 0 and < Nyquist. */
  lowestFrequencyHz: number;
  /** Assumed damping ratio of that mode, (0, 0.5); default 0.01. */
  assumedDampingRatio?: number;
  /** Required half-power bandwidth in lines, ≥ 1; default 3 [practice]. */
  linesPerBandwidth?: number;
  /** Minimum number of averages, integer ≥ 1; default 20 [practice]. */
  minAverages?: number;
}

export interface SegmentLengthChoice {
  nperseg: number;
  noverlap: number;
  lineSpacingHz: number;
  averages: number;
  /** Half-power bandwidth 2ζf of the lowest mode in lines at this segment length. */
  bandwidthLines: number;
  /** Periods of the lowest mode in the record. */
  cyclesInRecord: number;
  /** True when both the bandwidth and the averages rules hold and the record is ≥ 1000 periods. */
  dampingTrustworthy: boolean;
  warnings: string[];
}

/**
 * Chooses nperseg (a power of two, 50 % overlap) for a record.
 *
 * @param sampleRateHz - Hz, > 0.
 * @param recordLength - samples, integer ≥ 16.
 * @param options - see {@link SegmentLengthOptions}.
 * @returns the choice and warnings.
 * @throws TypeError / RangeError for bad arguments.
 */
export function chooseSegmentLength(sampleRateHz: number, recordLength: number, options: SegmentLengthOptions): SegmentLengthChoice {
  assertPositive(sampleRateHz, "sampleRateHz");
  assertInteger(recordLength, "recordLength", 16);
  if (typeof options !== "object" || options === null) throw new TypeError("options must be an object");
  assertPositive(options.lowestFrequencyHz, "lowestFrequencyHz");
  if (options.lowestFrequencyHz >= sampleRateHz / 2) throw new RangeError(`lowestFrequencyHz must be < Nyquist ${sampleRateHz / 2} Hz (got ${options.lowestFrequencyHz})`);
  const zeta = options.assumedDampingRatio ?? 0.01;
  assertInRange(zeta, "assumedDampingRatio", 1e-6, 0.5);
  const lines = options.linesPerBandwidth ?? 3;
  assertInRange(lines, "linesPerBandwidth", 1, 1000);
  const minAvg = options.minAverages ?? 20;
  assertInteger(minAvg, "minAverages", 1);
  const f = options.lowestFrequencyHz;
  const warnings: string[] = [];
  const averagesFor = (n: number): number => Math.floor((recordLength - n / 2) / (n / 2));
  // Δf ≤ 2ζf/lines  ⇔  nperseg ≥ lines·fs/(2ζf)
  let wanted = 8;
  while (wanted < (lines * sampleRateHz) / (2 * zeta * f)) wanted *= 2;
  let nperseg = wanted;
  while (nperseg > 8 && (nperseg > recordLength || averagesFor(nperseg) < minAvg)) nperseg /= 2;
  const df = sampleRateHz / nperseg;
  const bandwidthLines = (2 * zeta * f) / df;
  const averages = averagesFor(nperseg);
  const cycles = (f * recordLength) / sampleRateHz;
  if (nperseg < wanted) {
    warnings.push(
      `record too short for trustworthy damping: ${lines} lines across the half-power bandwidth of ${f} Hz at ζ = ${zeta} need nperseg ${wanted}, ` +
        `which leaves ${Math.max(0, averagesFor(wanted))} < ${minAvg} averages; using ${nperseg} (bandwidth ${bandwidthLines.toFixed(2)} lines, damping biased high)`,
    );
  }
  if (averages < minAvg) warnings.push(`only ${averages} averages (< ${minAvg}): spectral random error ≈ ${(100 / Math.sqrt(Math.max(1, averages))).toFixed(0)} %`);
  if (cycles < 1000) warnings.push(`record spans ${cycles.toFixed(0)} periods of ${f} Hz (< 1000, Cantieni 2005): damping scatters strongly`);
  return {
    nperseg,
    noverlap: nperseg / 2,
    lineSpacingHz: df,
    averages,
    bandwidthLines,
    cyclesInRecord: cycles,
    dampingTrustworthy: nperseg >= wanted && averages >= minAvg && cycles >= 1000,
    warnings,
  };
}
