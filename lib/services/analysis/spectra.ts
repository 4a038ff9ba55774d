/**
 * Display-size singular value spectra. A 600 s record at 8192-point segments has 4097 lines
 * per curve; a chart needs ≤ ~1000. Each output point is the line of largest s₁ in its bin
 * (s₂, s₃ their own bin maxima), so peaks survive on a log axis where a plain decimation
 * could drop a narrow resonance between kept lines.
 */
import type { AnalysisResult } from "@/lib/domain/records";

export interface SpectraJson { frequencyHz: number[]; s1: number[]; s2: number[] | null; s3: number[] | null }

export function downsampleSpectra(sv: AnalysisResult["singularValues"], maxPoints: number): SpectraJson {
  const n = sv.frequencyHz.length;
  if (n <= maxPoints) return { frequencyHz: sv.frequencyHz, s1: sv.s1, s2: sv.s2, s3: sv.s3 };
  const bin = Math.ceil(n / maxPoints);
  const out: SpectraJson = { frequencyHz: [], s1: [], s2: sv.s2 ? [] : null, s3: sv.s3 ? [] : null };
  const maxOf = (a: number[], lo: number, hi: number) => {
    let m = -Infinity;
    for (let i = lo; i < hi; i++) if (a[i] > m) m = a[i];
    return m;
  };
  for (let lo = 0; lo < n; lo += bin) {
    const hi = Math.min(n, lo + bin);
    let best = lo;
    for (let i = lo + 1; i < hi; i++) if (sv.s1[i] > sv.s1[best]) best = i;
    out.frequencyHz.push(sv.frequencyHz[best]);
    out.s1.push(sv.s1[best]);
    if (out.s2 && sv.s2) out.s2.push(maxOf(sv.s2, lo, hi));
    if (out.s3 && sv.s3) out.s3.push(maxOf(sv.s3, lo, hi));
  }
  return out;
}
