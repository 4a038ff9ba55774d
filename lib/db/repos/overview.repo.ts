/**
 * Reads of the Asset Overview (issue 6 §1): data availability over a window (records per
 * day, channel quality per day), gateways with their
 * last contact, open alerts. Days are calendar days in the organisation's time zone.
 * Every read takes the current result of a record (the settings version it was last
 * analysed with), as the Records screen does.
 */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { AlertState } from "@/lib/domain/drift";

/** Quality flags that make a channel unusable in a record (lib/signal/quality EXCLUDING). */
export const EXCLUDING_FLAGS = ["non_finite", "gap", "clipping", "flat_line"] as const;

export interface DayWindow { from: Date; to: Date; timeZone: string }

export interface RecordsPerDay { day: string; total: number; analysed: number; rejected: number; failed: number }

/** Records that started in [from, to) per local day (YYYY-MM-DD), days without records omitted. */
export async function countRecordsPerDay(db: Db, assetId: string, w: DayWindow): Promise<RecordsPerDay[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select to_char((r.started_at at time zone ?)::date, 'YYYY-MM-DD') as day,
              count(*)::int as total,
              count(*) filter (where r.status = 'analysed')::int as analysed,
              count(*) filter (where r.status = 'rejected')::int as rejected,
              count(*) filter (where r.status = 'failed')::int as failed
         from records r
        where r.asset_id = ? and r.started_at >= ? and r.started_at < ?
        group by 1 order by 1`,
      [w.timeZone, assetId, w.from, w.to],
    ),
  );
  return (res as { rows: RecordsPerDay[] }).rows;
}

export interface ChannelDay {
  day: string;
  channel: string;
  /** Analysed records of the day that carried the channel. */
  records: number;
  /** Of those, records where a flag excluded the channel (flat line, clipping, gaps, non-finite). */
  excluded: number;
  /** Every quality flag seen on the channel that day. */
  flags: string[];
}

/** Channel quality per local day from the stored quality reports of the records' current results. */
export async function listChannelQualityPerDay(db: Db, assetId: string, w: DayWindow): Promise<ChannelDay[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `with q as (
         select r.id as record_id, (r.started_at at time zone ?)::date as day, ch->>'channel' as channel, ch->'flags' as flags
           from records r
           join analysis_results ar on ar.record_id = r.id and ar.settings_version = r.analysed_settings_version
           cross join lateral jsonb_array_elements(coalesce(ar.quality->'channels', '[]'::jsonb)) ch
          where r.asset_id = ? and r.started_at >= ? and r.started_at < ?
       )
       select to_char(q.day, 'YYYY-MM-DD') as day, q.channel,
              count(distinct q.record_id)::int as records,
              count(distinct q.record_id) filter (where jsonb_exists_any(q.flags, ?::text[]))::int as excluded,
              coalesce(array_remove(array_agg(distinct f.flag), null), '{}') as flags
         from q left join lateral jsonb_array_elements_text(q.flags) f(flag) on true
        group by q.day, q.channel
        order by q.day, q.channel`,
      [w.timeZone, assetId, w.from, w.to, [...EXCLUDING_FLAGS]],
    ),
  );
  return (res as { rows: ChannelDay[] }).rows;
}

/** When each deactivated channel of the asset was last switched (audit `channel.update` naming `active`). */
export async function listChannelDeactivations(db: Db, assetId: string): Promise<{ channelId: string; at: Date }[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select c.id as "channelId", max(al.at) as at
         from sensor_channels c
         join audit_log al on al.subject_id = c.id and al.action = 'channel.update' and al.details->'fields' @> '["active"]'::jsonb
        where c.asset_id = ? and not c.active
        group by c.id`,
      [assetId],
    ),
  );
  return (res as { rows: { channelId: string; at: Date }[] }).rows;
}

export interface GatewayContact {
  id: string;
  name: string;
  keyPrefix: string;
  firmwareVersion: string | null;
  lastSeenAt: Date | null;
  lastHeartbeatAt: Date | null;
  /** Start of the newest record the gateway uploaded. */
  lastRecordAt: Date | null;
  revokedAt: Date | null;
}

export async function listGatewayContacts(db: Db, assetId: string): Promise<GatewayContact[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select g.id, g.name, g.key_prefix as "keyPrefix", g.firmware_version as "firmwareVersion", g.last_seen_at as "lastSeenAt",
              g.last_heartbeat_at as "lastHeartbeatAt", g.revoked_at as "revokedAt",
              (select max(r.started_at) from records r where r.gateway_id = g.id) as "lastRecordAt"
         from gateways g where g.asset_id = ?
        order by (g.revoked_at is not null), g.created_at, g.id`,
      [assetId],
    ),
  );
  return (res as { rows: GatewayContact[] }).rows;
}

export interface OpenAlertRow { id: string; state: AlertState; raisedAt: Date; assigneeLabel: string | null; inspectionAt: Date | null }

/** Alerts of the asset that are not closed, newest raise first. */
export async function listOpenAlertsOfAsset(db: Db, assetId: string): Promise<OpenAlertRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select al.id, al.state, al.raised_at as "raisedAt", al.inspection_at as "inspectionAt",
              coalesce(u.display_name, u.email) as "assigneeLabel"
         from alerts al left join users u on u.id = al.assignee_user_id
        where al.asset_id = ? and al.state <> 'closed'
        order by al.raised_at desc, al.id desc`,
      [assetId],
    ),
  );
  return (res as { rows: OpenAlertRow[] }).rows;
}
