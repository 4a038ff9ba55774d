/**
 * npm run bench — timing of the FDD + EFDD + half-power chain on the standard record
 * (16 channels, 200 Hz, 600 s, segments of 2048 samples, 50 % overlap), each stage and the
 * whole, median and spread over RUNS runs after one warm-up; peak resident memory; the
 * SciPy/NumPy reference of the same spectral chain (scripts/bench_reference.py) with the
 * ratio; and SSI-COV (4 reference channels, decimated to 50 Hz, orders up to 80) when
 * lib/modal/ssi-cov.ts exists. Prints a human-readable report; not a test.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import path from "node:path";
import { decomposeCsdMatrix, singularVector } from "@/lib/modal/fdd";
import { estimateEfdd } from "@/lib/modal/efdd";
import { halfPowerDamping } from "@/lib/modal/half-power";
import { pickFddPeaks } from "@/lib/modal/peak-picking";
import { estimateCsdMatrix } from "@/lib/signal/welch-csd";
import { decimate } from "@/lib/signal/decimate";
import { shearFrameModes, simulateAmbientRecord } from "@/lib/simulate";

const RUNS = 7;
const N_CH = 16, FS = 200, DURATION_S = 600, NPERSEG = 2048;

function stats(xs: number[]): { median: number; min: number; max: number } {
  const a = [...xs].sort((p, q) => p - q);
  const median = a.length % 2 ? a[(a.length - 1) / 2] : 0.5 * (a[a.length / 2 - 1] + a[a.length / 2]);
  return { median, min: a[0], max: a[a.length - 1] };
}
const fmt = (s: { median: number; min: number; max: number }) => `${s.median.toFixed(1)} ms (min ${s.min.toFixed(1)}, max ${s.max.toFixed(1)})`;

function runChain(data: Float64Array[]): Record<string, number> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const csd = estimateCsdMatrix(data, FS, { nperseg: NPERSEG, noverlap: NPERSEG / 2 });
  const t1 = performance.now();
  const fdd = decomposeCsdMatrix(csd);
  const t2 = performance.now();
  const { peaks } = pickFddPeaks(fdd);
  const t3 = performance.now();
  for (const p of peaks) {
    estimateEfdd(fdd, p.line, singularVector(fdd, p.line, p.rank));
    halfPowerDamping(fdd.singularValues[p.rank], fdd.lineSpacingHz, p.line);
  }
  const t4 = performance.now();
  const cpu = process.cpuUsage(c0);
  return { csd: t1 - t0, svd: t2 - t1, peaks: t3 - t2, damping: t4 - t3, total: t4 - t0, cpu: (cpu.user + cpu.system) / 1000, modes: peaks.length };
}

async function main(): Promise<void> {
  // Standard record: a 16-storey shear frame (f₁ ≈ 1 Hz), ζ = 1 %, one sensor per floor.
  const modes = shearFrameModes(N_CH, 4.1e7, 1e5).slice(0, 10).map((m) => ({ ...m, dampingRatio: 0.01 }));
  const rec = simulateAmbientRecord({ modes, sampleRateHz: FS, durationS: DURATION_S, seed: 2024 });
  const data = rec.data;
  console.log(`standard record: ${N_CH} ch × ${data[0].length} samples (${FS} Hz, ${DURATION_S} s), nperseg ${NPERSEG}, 50 % overlap; node ${process.version}`);
  // Wall-clock figures are only meaningful on an otherwise idle machine: say how busy it was.
  console.log(`load average at start: ${loadavg().map((x) => x.toFixed(2)).join(" ")}`);

  runChain(data); // warm-up: JIT compilation
  const runs: Record<string, number>[] = [];
  for (let i = 0; i < RUNS; i++) runs.push(runChain(data));
  console.log(`\nFDD chain over ${RUNS} runs (after 1 warm-up), ${runs[0].modes} modes picked:`);
  for (const k of ["csd", "svd", "peaks", "damping", "total", "cpu"]) console.log(`  ${k.padEnd(8)} ${fmt(stats(runs.map((r) => r[k])))}`);
  const ours = stats(runs.map((r) => r.total)).median;

  // SciPy/NumPy reference on the same record (float32 file, as an upload would carry it).
  const dir = mkdtempSync(path.join(tmpdir(), "modewarden-bench-"));
  try {
    const f32 = new Float32Array(data[0].length * N_CH);
    for (let s = 0; s < data[0].length; s++) for (let c = 0; c < N_CH; c++) f32[s * N_CH + c] = data[c][s];
    const file = path.join(dir, "standard.f32");
    writeFileSync(file, Buffer.from(f32.buffer));
    const script = path.resolve(__dirname, "bench_reference.py");
    const py = spawnSync("/usr/bin/python3", [script, file, String(N_CH), String(FS), String(NPERSEG), "5"], { encoding: "utf8", timeout: 300_000 });
    if (py.status === 0) {
      const ref = JSON.parse(py.stdout.trim().split("\n").pop() ?? "{}") as { medianMs: number; runsMs: number[]; scipy: string; numpy: string };
      console.log(`\nSciPy ${ref.scipy} / NumPy ${ref.numpy} reference (scipy.signal.csd + numpy.linalg.svd), 5 runs: ${fmt(stats(ref.runsMs))}`);
      console.log(`ratio ours/reference: ${(ours / ref.medianMs).toFixed(2)} (target ≤ 1.0)`);
    } else {
      console.log(`\nSciPy reference skipped: /usr/bin/python3 with scipy failed (${(py.stderr || String(py.error)).trim().split("\n").pop()})`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }

  // SSI-COV, if Engine B's module exists: 4 references, decimated to 50 Hz, orders to 80.
  try {
    const ssi = await import("@/lib/modal/ssi-cov");
    const q = FS / 50;
    const tDec0 = performance.now();
    const dec = data.map((x) => decimate(x, q));
    const decMs = performance.now() - tDec0;
    const rec50 = { sampleRateHz: 50, channels: data.map((_, i) => `C${i + 1}`), data: dec };
    ssi.identifyModesSsiCov(rec50, { maxOrder: 80, referenceChannels: [3, 7, 11, 15] });
    const ssiRuns: number[] = [];
    for (let i = 0; i < 5; i++) {
      const t = performance.now();
      ssi.identifyModesSsiCov(rec50, { maxOrder: 80, referenceChannels: [3, 7, 11, 15] });
      ssiRuns.push(performance.now() - t);
    }
    console.log(`\nSSI-COV (4 refs, 50 Hz after ${q}× decimation in ${decMs.toFixed(0)} ms, orders ≤ 80), 5 runs: ${fmt(stats(ssiRuns))} (target ≤ 2000 ms)`);
  } catch (e) {
    console.log(`\nSSI-COV skipped: ${(e as Error).message}`);
  }

  const rss = process.resourceUsage().maxRSS / 1024;
  console.log(`\npeak resident memory: ${rss.toFixed(0)} MB (target ≤ 300 MB)`);
  console.log(`\nFDD chain median ${ours.toFixed(1)} ms wall, ${stats(runs.map((r) => r.cpu)).median.toFixed(1)} ms CPU (target ≤ 150 ms); load average now ${loadavg()[0].toFixed(2)}`);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
