/**
 * The asset's modal history as lib/stats wants it: one row per analysed record or imported
 * time, per tracked mode its frequency (NaN when not identified), the row's temperature and
 * its data-quality flag.
 */
import type { Db } from "@/lib/db/knex";
import { listHistoryPoints } from "@/lib/db/repos/modal-estimate.repo";
import type { AssetHistory } from "@/lib/stats/drift-monitor";

/** AssetHistory with concrete typed arrays (slices with subarray). */
export interface LoadedAssetHistory extends AssetHistory {
  timesMs: Float64Array;
  temperatureC: Float64Array;
  qualityPassed: Uint8Array;
  modes: { modeId: string; frequencyHz: Float64Array }[];
}

export interface LoadedHistory {
  history: LoadedAssetHistory;
  /** Times of accepted records uploaded by gateways (for silence), ms UTC. */
  recordTimesMs: number[];
  /** Per mode (same order as history.modes) its damping ratio per row (NaN = none). */
  dampingRatio: Float64Array[];
}

export async function loadAssetHistory(db: Db, assetId: string, modeIds: string[], range: { from?: Date; to?: Date } = {}): Promise<LoadedHistory> {
  const points = await listHistoryPoints(db, assetId, range);
  const col = new Map(modeIds.map((id, j) => [id, j]));
  const rows: { t: number; temp: number; q: number; f: number[]; d: number[]; rec: boolean }[] = [];
  const byKey = new Map<string, (typeof rows)[number]>();
  for (const p of points) {
    let row = byKey.get(p.key);
    if (!row) {
      row = { t: p.at.getTime(), temp: p.temperatureC, q: p.qualityPassed ? 1 : 0, f: modeIds.map(() => Number.NaN), d: modeIds.map(() => Number.NaN), rec: p.fromRecord };
      byKey.set(p.key, row);
      rows.push(row);
    }
    const j = p.trackedModeId ? col.get(p.trackedModeId) : undefined;
    if (j !== undefined && p.frequencyHz !== null) {
      row.f[j] = p.frequencyHz;
      if (p.dampingRatio !== null) row.d[j] = p.dampingRatio;
    }
  }
  return {
    history: {
      timesMs: Float64Array.from(rows, (r) => r.t),
      temperatureC: Float64Array.from(rows, (r) => r.temp),
      qualityPassed: Uint8Array.from(rows, (r) => r.q),
      modes: modeIds.map((modeId, j) => ({ modeId, frequencyHz: Float64Array.from(rows, (r) => r.f[j]) })),
    },
    recordTimesMs: rows.filter((r) => r.rec && r.q).map((r) => r.t),
    dampingRatio: modeIds.map((_, j) => Float64Array.from(rows, (r) => r.d[j])),
  };
}
