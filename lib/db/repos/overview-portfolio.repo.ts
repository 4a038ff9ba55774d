/**
 * Reads of the Portfolio's "needs attention" list (issue 6 §5), one query per kind of item,
 * all scoped to one organisation.
 */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { AlertState, BaselineStatus } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";
import { EXCLUDING_FLAGS } from "./overview.repo";

export interface AttentionAlertRow { id: string; assetId: string; assetName: string; state: AlertState; raisedAt: Date }

/** Alerts of the organisation that are not closed, oldest raise first (longest waiting on top). */
export async function listLiveAlertsOfOrganisation(db: Db, organisationId: string): Promise<AttentionAlertRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select al.id, al.asset_id as "assetId", a.name as "assetName", al.state, al.raised_at as "raisedAt"
         from alerts al join assets a on a.id = al.asset_id
        where a.organisation_id = ? and al.state <> 'closed'
        order by al.raised_at, al.id`,
      [organisationId],
    ),
  );
  return (res as { rows: AttentionAlertRow[] }).rows;
}

export interface AssetBaselineRow {
  assetId: string;
  assetName: string;
  condition: AssetCondition;
  expectedIntervalMin: number;
  /** Status and version of the active baseline, null without one. */
  baselineStatus: BaselineStatus | null;
  baselineVersion: number | null;
  /** Start of the newest record that was analysed (accepted), null when none. */
  lastAnalysedAt: Date | null;
}

/** Every asset of the organisation with its active baseline and last analysed record, by name. */
export async function listAssetBaselineStates(db: Db, organisationId: string): Promise<AssetBaselineRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select a.id as "assetId", a.name as "assetName", a.condition, a.expected_interval_min as "expectedIntervalMin",
              b.status as "baselineStatus", b.version as "baselineVersion",
              (select max(r.started_at) from records r where r.asset_id = a.id and r.status = 'analysed') as "lastAnalysedAt"
         from assets a left join baselines b on b.asset_id = a.id and b.active
        where a.organisation_id = ?
        order by a.name, a.id`,
      [organisationId],
    ),
  );
  return (res as { rows: AssetBaselineRow[] }).rows;
}

export interface ChannelIssueRow {
  assetId: string;
  assetName: string;
  channel: string;
  flags: string[];
  /** Start of the asset's latest analysed record, where the channel was excluded. */
  latestAt: Date;
  /** Records of the last `days` days carrying the channel, and how many excluded it. */
  recentRecords: number;
  recentExcluded: number;
}

/**
 * Channels excluded by a quality flag (flat line, clipping, gaps, non-finite) in the latest
 * analysed record of each asset, with how often that happened over the last `days` days.
 */
export async function listChannelIssues(db: Db, organisationId: string, days: number, now: Date): Promise<ChannelIssueRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select a.id as "assetId", a.name as "assetName", ch->>'channel' as channel,
              array(select jsonb_array_elements_text(ch->'flags')) as flags, lr.started_at as "latestAt",
              rc.records::int as "recentRecords", rc.excluded::int as "recentExcluded"
         from assets a
         cross join lateral (
           select r.started_at, ar.quality from records r
             join analysis_results ar on ar.record_id = r.id and ar.settings_version = r.analysed_settings_version
            where r.asset_id = a.id and r.status = 'analysed' order by r.started_at desc, r.id desc limit 1
         ) lr
         cross join lateral jsonb_array_elements(coalesce(lr.quality->'channels', '[]'::jsonb)) ch
         cross join lateral (
           select count(*) as records, count(*) filter (where jsonb_exists_any(c2->'flags', ?::text[])) as excluded
             from records r2
             join analysis_results ar2 on ar2.record_id = r2.id and ar2.settings_version = r2.analysed_settings_version
             cross join lateral jsonb_array_elements(coalesce(ar2.quality->'channels', '[]'::jsonb)) c2
            where r2.asset_id = a.id and r2.started_at >= ?::timestamptz - make_interval(days => ?) and r2.started_at <= ?
              and c2->>'channel' = ch->>'channel'
         ) rc
        where a.organisation_id = ? and jsonb_exists_any(ch->'flags', ?::text[])
        order by a.name, channel`,
      [[...EXCLUDING_FLAGS], now, days, now, organisationId, [...EXCLUDING_FLAGS]],
    ),
  );
  return (res as { rows: ChannelIssueRow[] }).rows;
}
