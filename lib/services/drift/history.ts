/**
 * The asset's modal history as lib/stats wants it: one row per analysed record or imported
 * time, per tracked mode its frequency (NaN when not identified), the row's temperature and
 * its data-quality flag.
 */
import type { Db } from "@/lib/db/knex";
import { listHistoryPoints } from "@/lib/db/repos/modal-estimate.repo";
import type { AssetHistory } from "@/lib/stats/drift-monitor";

export interface LoadedHistory {
  history: AssetHistory;
  /** Times of accepted records uploaded by gateways (for silence), ms UTC. */
  recordTimesMs: number[];
}

export async function loadAssetHistory(db: Db, assetId: string, modeIds: string[], range: { from?: Date; to?: Date } = {}): Promise<LoadedHistory> {
  const points = await listHistoryPoints(db, assetId, range);
  const col = new Map(modeIds.map((id, j) => [id, j]));
  const rows: { t: number; temp: number; q: number; f: number[]; rec: boolean }[] = [];
  const byKey = new Map<string, (typeof rows)[number]>();
  for (const p of points) {
    let row = byKey.get(p.key);
    if (!row) {
      row = { t: p.at.getTime(), temp: p.temperatureC, q: p.qualityPassed ? 1 : 0, f: modeIds.map(() => Number.NaN), rec: p.fromRecord };
      byKey.set(p.key, row);
      rows.push(row);
    }
    const j = p.trackedModeId ? col.get(p.trackedModeId) : undefined;
    if (j !== undefined && p.frequencyHz !== null) row.f[j] = p.frequencyHz;
  }
  return {
    history: {
      timesMs: Float64Array.from(rows, (r) => r.t),
      temperatureC: Float64Array.from(rows, (r) => r.temp),
      qualityPassed: Uint8Array.from(rows, (r) => r.q),
      modes: modeIds.map((modeId, j) => ({ modeId, frequencyHz: Float64Array.from(rows, (r) => r.f[j]) })),
    },
    recordTimesMs: rows.filter((r) => r.rec && r.q).map((r) => r.t),
  };
}
