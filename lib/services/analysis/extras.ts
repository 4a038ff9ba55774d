/**
 * Display data stored beside a result: the FRF of every response channel against a measured
 * force channel (forced tests: shaker or instrumented hammer), downsampled for charts.
 * H1 = G_fx / G_ff with ordinary coherence [pub: Bendat & Piersol, Random Data, §6.1].
 */
import type { AnalysisExtras, FrfChannelData } from "@/lib/domain/records";
import { estimateFrfH1 } from "@/lib/modal/frf";

/** Most lines kept per FRF curve (each kept line is the largest |H| of its bin, so resonances survive). */
export const FRF_MAX_POINTS = 1024;

/**
 * FRF data of a record with one force channel, or null when the estimate fails (too short,
 * no force power): the identification result stands without it.
 * @param force - force samples (N); `responses` m/s² per channel, same length; `nperseg` as the FDD used.
 */
export function frfExtras(
  sampleRateHz: number, forceChannel: string, force: Float64Array, responseChannels: string[], responses: Float64Array[], nperseg: number,
): AnalysisExtras["frf"] {
  if (responses.length === 0) return null;
  let est;
  try {
    est = estimateFrfH1({ sampleRateHz, force, responses }, { nperseg: Math.min(nperseg, floorPow2(force.length)) });
  } catch {
    return null;
  }
  const n = est.frequencyHz.length;
  const bin = Math.max(1, Math.ceil(n / FRF_MAX_POINTS));
  const keep: number[] = [];
  const mag0 = (i: number) => Math.hypot(est.h[0].re[i], est.h[0].im[i]);
  for (let lo = 0; lo < n; lo += bin) {
    let best = lo;
    for (let i = lo + 1; i < Math.min(n, lo + bin); i++) if (mag0(i) > mag0(best)) best = i;
    keep.push(best);
  }
  const finite = (v: number) => (Number.isFinite(v) ? v : 0);
  const channels: FrfChannelData[] = responseChannels.map((channel, c) => ({
    channel,
    magnitude: keep.map((i) => finite(Math.hypot(est.h[c].re[i], est.h[c].im[i]))),
    phaseRad: keep.map((i) => finite(Math.atan2(est.h[c].im[i], est.h[c].re[i]))),
    coherence: keep.map((i) => finite(est.coherence[c][i])),
  }));
  return { forceChannel, frequencyHz: keep.map((i) => est.frequencyHz[i]), channels };
}

function floorPow2(n: number): number {
  return 2 ** Math.floor(Math.log2(Math.max(16, n)));
}
