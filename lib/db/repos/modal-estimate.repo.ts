import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

export interface ModalEstimateWrite {
  trackedModeId: string;
  at: Date;
  frequencyHz: number;
  dampingRatio: number | null;
  temperatureC: number | null;
  source: string;
}

/** Insert estimates; rows already present (same asset, mode, time, source) are skipped. Returns the number inserted. */
export async function insertModalEstimates(db: Db, assetId: string, rows: ModalEstimateWrite[]): Promise<number> {
  let inserted = 0;
  for (let i = 0; i < rows.length; i += 1000) {
    const chunk = rows.slice(i, i + 1000).map((r) => ({
      asset_id: assetId, tracked_mode_id: r.trackedModeId, at: r.at, frequency_hz: r.frequencyHz,
      damping_ratio: r.dampingRatio, temperature_c: r.temperatureC, source: r.source,
    }));
    const out = await withDbErrors(() =>
      db("modal_estimates").insert(chunk).onConflict(["asset_id", "tracked_mode_id", "at", "source"]).ignore().returning("id"),
    );
    inserted += out.length;
  }
  return inserted;
}

/** How many estimates of the asset carry `source`. */
export async function countEstimatesOfSource(db: Db, assetId: string, source: string): Promise<number> {
  const [row] = await withDbErrors(() => db("modal_estimates").where({ asset_id: assetId, source }).count<{ count: string }[]>({ count: "*" }));
  return Number(row?.count ?? 0);
}

/** One identified frequency of a tracked mode at one time: from an analysed record or an import. */
export interface HistoryPoint {
  /** Groups points of the same record / import row time. */
  key: string;
  at: Date;
  trackedModeId: string | null;
  frequencyHz: number | null;
  /** Damping ratio (fraction) of the estimate, null when none was estimated. */
  dampingRatio: number | null;
  temperatureC: number;
  qualityPassed: boolean;
  fromRecord: boolean;
}

/**
 * The asset's modal history from `from` on (optional `to`, exclusive): current results of
 * analysed or rejected records with a temperature (their tracked-mode assignments), and
 * imported estimates with a temperature. Ordered by time.
 */
export async function listHistoryPoints(db: Db, assetId: string, range: { from?: Date; to?: Date } = {}): Promise<HistoryPoint[]> {
  const recs = db("records as r")
    .join("analysis_results as ar", function joinCurrent() {
      this.on("ar.record_id", "=", "r.id").andOn("ar.settings_version", "=", "r.analysed_settings_version");
    })
    .leftJoin("mode_assignments as ma", "ma.result_id", "ar.id")
    .leftJoin("identified_modes as im", "im.id", "ma.identified_mode_id")
    .where("r.asset_id", assetId)
    .whereIn("r.status", ["analysed", "rejected"])
    .whereNotNull("r.temperature_c")
    .select("r.id as record_id", "r.started_at as at", "r.temperature_c", "ar.verdict", "ma.tracked_mode_id", "im.frequency_hz", "im.damping_ratio");
  if (range.from) recs.where("r.started_at", ">=", range.from);
  if (range.to) recs.where("r.started_at", "<", range.to);
  const imps = db("modal_estimates").where({ asset_id: assetId }).whereNotNull("temperature_c")
    .select("at", "source", "tracked_mode_id", "frequency_hz", "damping_ratio", "temperature_c");
  if (range.from) imps.where("at", ">=", range.from);
  if (range.to) imps.where("at", "<", range.to);
  const [recRows, impRows] = await withDbErrors(() => Promise.all([
    recs as unknown as Promise<{ record_id: string; at: Date; temperature_c: number; verdict: string; tracked_mode_id: string | null; frequency_hz: number | null; damping_ratio: number | null }[]>,
    imps as unknown as Promise<{ at: Date; source: string; tracked_mode_id: string; frequency_hz: number; damping_ratio: number | null; temperature_c: number }[]>,
  ]));
  const points: HistoryPoint[] = [
    ...recRows.map((r) => ({
      key: `r:${r.record_id}`, at: r.at, trackedModeId: r.tracked_mode_id, frequencyHz: r.frequency_hz, dampingRatio: r.damping_ratio,
      temperatureC: r.temperature_c, qualityPassed: r.verdict !== "reject", fromRecord: true,
    })),
    ...impRows.map((r) => ({
      key: `i:${r.at.getTime()}:${r.source}`, at: r.at, trackedModeId: r.tracked_mode_id, frequencyHz: r.frequency_hz, dampingRatio: r.damping_ratio,
      temperatureC: r.temperature_c, qualityPassed: true, fromRecord: false,
    })),
  ];
  return points.sort((a, b) => a.at.getTime() - b.at.getTime() || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}
