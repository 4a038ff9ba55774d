/**
 * Identification rates of an asset's tracked modes over a period, counted in SQL. A record
 * counts when it is `analysed` and started in [from, to); only its current result (the
 * settings version it was last analysed with) is looked at, so a reprocessed record is
 * counted once, with its newest outcome.
 */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

/** Current results of the asset's analysed records that started in [from, to). */
const CURRENT_RESULTS = `
  select ar.id as result_id, r.started_at
  from records r
  join analysis_results ar on ar.record_id = r.id and ar.settings_version = r.analysed_settings_version
  where r.asset_id = ? and r.status = 'analysed' and r.started_at >= ? and r.started_at < ?`;

export interface ModeIdentificationCount {
  trackedModeId: string;
  /** Records of the period whose current result sought the mode (had an assignment row for it). */
  sought: number;
  /** Of those, the records where an identified mode was assigned to it. */
  identified: number;
  lastIdentifiedAt: Date | null;
}

/** One row per tracked mode of the asset (active or not), zero counts included. */
export async function countModeIdentificationsInPeriod(db: Db, assetId: string, from: Date, to: Date): Promise<ModeIdentificationCount[]> {
  const { rows } = await withDbErrors(() =>
    db.raw<{ rows: { tracked_mode_id: string; sought: string; identified: string; last_identified_at: Date | null }[] }>(
      `with cur as (${CURRENT_RESULTS})
       select tm.id as tracked_mode_id,
         count(cur.result_id) as sought,
         count(cur.result_id) filter (where ma.identified_mode_id is not null) as identified,
         max(cur.started_at) filter (where ma.identified_mode_id is not null) as last_identified_at
       from tracked_modes tm
       left join (mode_assignments ma join cur on cur.result_id = ma.result_id) on ma.tracked_mode_id = tm.id
       where tm.asset_id = ?
       group by tm.id`,
      [assetId, from, to, assetId],
    ),
  );
  return rows.map((r) => ({
    trackedModeId: r.tracked_mode_id, sought: Number(r.sought), identified: Number(r.identified), lastIdentifiedAt: r.last_identified_at,
  }));
}

export interface PeriodIdentificationSummary {
  /** Analysed records of the period. */
  analysedRecords: number;
  /** Identified modes of those records assigned to no tracked mode. */
  unassignedModes: number;
  /** Records of the period with at least one unassigned mode. */
  recordsWithUnassigned: number;
}

/** Record and unassigned-mode counts of the period. */
export async function summariseIdentificationsInPeriod(db: Db, assetId: string, from: Date, to: Date): Promise<PeriodIdentificationSummary> {
  const { rows } = await withDbErrors(() =>
    db.raw<{ rows: { analysed_records: string; unassigned_modes: string; records_with_unassigned: string }[] }>(
      `with cur as (${CURRENT_RESULTS}),
       unassigned as (
         select im.result_id from identified_modes im
         join cur on cur.result_id = im.result_id
         where not exists (select 1 from mode_assignments ma where ma.identified_mode_id = im.id)
       )
       select (select count(*) from cur) as analysed_records,
         (select count(*) from unassigned) as unassigned_modes,
         (select count(distinct result_id) from unassigned) as records_with_unassigned`,
      [assetId, from, to],
    ),
  );
  const r = rows[0];
  return {
    analysedRecords: Number(r.analysed_records), unassignedModes: Number(r.unassigned_modes), recordsWithUnassigned: Number(r.records_with_unassigned),
  };
}
