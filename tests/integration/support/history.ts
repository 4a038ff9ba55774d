/** Simulated drift histories (lib/stats/drift-simulation) written as the modal-history import CSV. */
import type { AssetHistory } from "@/lib/stats/drift-monitor";

/**
 * One row per mode estimate of every record that passed quality (records failing it are left
 * out, as a consultant would); `damping(i)` gives record i's damping column ("" = empty).
 */
export function simulatedHistoryCsv(h: AssetHistory, damping: (i: number) => string = () => ""): string {
  const lines = ["timestamp,mode,frequencyHz,dampingRatio,temperatureC"];
  for (let i = 0; i < h.timesMs.length; i++) {
    if (h.qualityPassed && !h.qualityPassed[i]) continue;
    const ts = new Date(h.timesMs[i]).toISOString();
    for (const m of h.modes) lines.push(`${ts},${m.modeId},${m.frequencyHz[i]},${damping(i)},${h.temperatureC[i]}`);
  }
  return lines.join("\n");
}
