/**
 * "What changed since <date>" on the Asset Overview: versions of the versioned tables
 * (baselines, analysis settings), alerts and their events, and the audit entries about the
 * asset's channels, tracked modes, gateways and description. Each read is bounded by `limit`.
 */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { AlertEventKind, AlertState, BaselineStatus } from "@/lib/domain/drift";

export interface BaselineVersionRow {
  id: string; version: number; status: BaselineStatus; active: boolean; createdAt: Date;
  trainingFrom: Date; trainingTo: Date; byLabel: string | null; modeCount: number;
}

export async function listBaselineVersionsSince(db: Db, assetId: string, since: Date, limit: number): Promise<BaselineVersionRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select b.id, b.version, b.status, b.active, b.created_at as "createdAt", b.training_from as "trainingFrom",
              b.training_to as "trainingTo", coalesce(u.display_name, u.email) as "byLabel",
              jsonb_array_length(b.models)::int as "modeCount"
         from baselines b left join users u on u.id = b.created_by
        where b.asset_id = ? and b.created_at >= ?
        order by b.created_at desc, b.version desc limit ?`,
      [assetId, since, limit],
    ),
  );
  return (res as { rows: BaselineVersionRow[] }).rows;
}

export interface SettingsVersionRow { version: number; createdAt: Date; byLabel: string | null }

export async function listSettingsVersionsSince(db: Db, assetId: string, since: Date, limit: number): Promise<SettingsVersionRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select s.version, s.created_at as "createdAt", coalesce(u.display_name, u.email) as "byLabel"
         from analysis_settings s left join users u on u.id = s.created_by_user_id
        where s.asset_id = ? and s.created_at >= ?
        order by s.created_at desc, s.version desc limit ?`,
      [assetId, since, limit],
    ),
  );
  return (res as { rows: SettingsVersionRow[] }).rows;
}

export interface AlertChangeRow {
  alertId: string; kind: AlertEventKind; at: Date; state: AlertState; details: Record<string, unknown>; byLabel: string | null;
}

/**
 * Alert events of the asset since the date: raises by their raise time (a replay may raise an
 * alert dated in the past), every other event by its own time.
 */
export async function listAlertChangesSince(db: Db, assetId: string, since: Date, limit: number): Promise<AlertChangeRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select * from (
         select al.id as "alertId", 'raised' as kind, al.raised_at as at, al.state, '{}'::jsonb as details, null::text as "byLabel"
           from alerts al where al.asset_id = ? and al.raised_at >= ?
         union all
         select e.alert_id, e.kind, e.at, al.state, e.details, coalesce(u.display_name, u.email)
           from alert_events e join alerts al on al.id = e.alert_id left join users u on u.id = e.actor_user_id
          where al.asset_id = ? and e.kind <> 'raised' and e.at >= ?
       ) x order by at desc limit ?`,
      [assetId, since, assetId, since, limit],
    ),
  );
  return (res as { rows: AlertChangeRow[] }).rows;
}

/** Audit actions shown as changes of the asset (baselines, settings and alerts come from their tables). */
export const OVERVIEW_AUDIT_ACTIONS = [
  "asset.update", "channel.create", "channel.update", "tracked_mode.create", "tracked_mode.update", "tracked_mode.deactivate",
  "gateway.create", "gateway.revoke", "history.import", "record.reprocess_range",
] as const;

export interface AuditChangeRow { id: string; action: string; at: Date; details: Record<string, unknown>; byLabel: string | null }

export async function listAuditChangesSince(db: Db, organisationId: string, assetId: string, since: Date, limit: number): Promise<AuditChangeRow[]> {
  const res = await withDbErrors(() =>
    db.raw(
      `select al.id, al.action, al.at, al.details, coalesce(u.display_name, u.email) as "byLabel"
         from audit_log al left join users u on u.id = al.actor_user_id
        where al.organisation_id = ? and al.at >= ? and al.action in (${OVERVIEW_AUDIT_ACTIONS.map(() => "?").join(", ")})
          and (al.subject_id = ? or al.details->>'assetId' = ?)
        order by al.at desc, al.id desc limit ?`,
      [organisationId, since, ...OVERVIEW_AUDIT_ACTIONS, assetId, assetId, limit],
    ),
  );
  return (res as { rows: AuditChangeRow[] }).rows;
}
