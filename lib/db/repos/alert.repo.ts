import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Alert, AlertEvent, AlertEventKind, AlertOutcome, AlertState } from "@/lib/domain/drift";

const COLS = [
  "id", "asset_id", "state", "outcome", "raised_at", "evidence", "assignee_user_id", "inspection_at", "closed_at", "findings", "created_at", "updated_at",
] as const;

interface AlertRow {
  id: string; asset_id: string; state: AlertState; outcome: AlertOutcome | null; raised_at: Date; evidence: Record<string, unknown>;
  assignee_user_id: string | null; inspection_at: Date | null; closed_at: Date | null; findings: string | null; created_at: Date; updated_at: Date;
}

const toAlert = (r: AlertRow): Alert => ({
  id: r.id, assetId: r.asset_id, state: r.state, outcome: r.outcome, raisedAt: r.raised_at, evidence: r.evidence,
  assigneeUserId: r.assignee_user_id, inspectionAt: r.inspection_at, closedAt: r.closed_at, findings: r.findings,
  createdAt: r.created_at, updatedAt: r.updated_at,
});

/** Alert with its asset's organisation and name (for the org check and messages). */
export interface AlertWithAsset extends Alert { organisationId: string; assetName: string }

const withAsset = (db: Db) =>
  db("alerts as al").join("assets as a", "a.id", "al.asset_id")
    .select(COLS.map((c) => `al.${c}`)).select("a.organisation_id", "a.name as asset_name");

const toAlertWithAsset = (r: AlertRow & { organisation_id: string; asset_name: string }): AlertWithAsset => ({
  ...toAlert(r), organisationId: r.organisation_id, assetName: r.asset_name,
});

/**
 * Insert an alert unless one with the same (asset, raise time) exists or the asset already
 * has an alert that is not closed (one episode at a time). Returns the new alert or null.
 */
export async function insertAlertIfNew(db: Db, a: { assetId: string; raisedAt: Date; evidence: Record<string, unknown> }): Promise<Alert | null> {
  await withDbErrors(() => db.raw("select id from assets where id = ? for update", [a.assetId]));
  const live = await withDbErrors(() => db("alerts").where({ asset_id: a.assetId }).whereNot({ state: "closed" }).first("id"));
  if (live) return null;
  const rows = await withDbErrors(() =>
    db("alerts").insert({ asset_id: a.assetId, raised_at: a.raisedAt, evidence: JSON.stringify(a.evidence), state: "open" })
      .onConflict(["asset_id", "raised_at"]).ignore().returning(COLS),
  );
  return rows.length ? toAlert(rows[0] as AlertRow) : null;
}

export async function findAlertById(db: Db, id: string, opts: { forUpdate?: boolean } = {}): Promise<AlertWithAsset | null> {
  const q = withAsset(db).where("al.id", id);
  if (opts.forUpdate) q.forUpdate("al");
  const row = await withDbErrors(() => q.first());
  return row ? toAlertWithAsset(row as AlertRow & { organisation_id: string; asset_name: string }) : null;
}

export interface AlertFilter { assetId?: string; state?: AlertState; assigneeUserId?: string; limit: number }

/** Alerts of an organisation: not closed first, then newest raise first. */
export async function listAlertsOfOrganisation(db: Db, organisationId: string, f: AlertFilter): Promise<AlertWithAsset[]> {
  const q = withAsset(db).where("a.organisation_id", organisationId);
  if (f.assetId) q.where("al.asset_id", f.assetId);
  if (f.state) q.where("al.state", f.state);
  if (f.assigneeUserId) q.where("al.assignee_user_id", f.assigneeUserId);
  const rows = await withDbErrors(() =>
    q.orderByRaw("(al.state = 'closed') asc, al.raised_at desc, al.id desc").limit(f.limit),
  );
  return (rows as (AlertRow & { organisation_id: string; asset_name: string })[]).map(toAlertWithAsset);
}

export type AlertPatch = Partial<Pick<Alert, "state" | "outcome" | "assigneeUserId" | "inspectionAt" | "closedAt" | "findings">>;

export async function updateAlertById(db: Db, id: string, p: AlertPatch): Promise<Alert | null> {
  const update: Record<string, unknown> = { updated_at: db.fn.now() };
  if (p.state !== undefined) update.state = p.state;
  if (p.outcome !== undefined) update.outcome = p.outcome;
  if (p.assigneeUserId !== undefined) update.assignee_user_id = p.assigneeUserId;
  if (p.inspectionAt !== undefined) update.inspection_at = p.inspectionAt;
  if (p.closedAt !== undefined) update.closed_at = p.closedAt;
  if (p.findings !== undefined) update.findings = p.findings;
  const [row] = await withDbErrors(() => db("alerts").where({ id }).update(update).returning(COLS));
  return row ? toAlert(row as AlertRow) : null;
}

/** Count of alerts not closed per asset of an organisation. */
export async function countOpenAlertsByAsset(db: Db, organisationId: string): Promise<Map<string, number>> {
  const rows = await withDbErrors(() =>
    db("alerts as al").join("assets as a", "a.id", "al.asset_id").where("a.organisation_id", organisationId).whereNot("al.state", "closed")
      .groupBy("al.asset_id").select("al.asset_id").count<{ asset_id: string; n: string }[]>({ n: "*" }),
  );
  return new Map(rows.map((r) => [r.asset_id, Number(r.n)]));
}

const EVENT_COLS = ["id", "alert_id", "actor_user_id", "kind", "details", "at"] as const;
interface AlertEventRow { id: string; alert_id: string; actor_user_id: string | null; kind: AlertEventKind; details: Record<string, unknown>; at: Date }

export async function insertAlertEvent(db: Db, e: { alertId: string; actorUserId: string | null; kind: AlertEventKind; details?: Record<string, unknown> }): Promise<AlertEvent> {
  const [row] = await withDbErrors(() =>
    db("alert_events").insert({ alert_id: e.alertId, actor_user_id: e.actorUserId, kind: e.kind, details: JSON.stringify(e.details ?? {}) }).returning(EVENT_COLS),
  );
  const r = row as AlertEventRow;
  return { id: r.id, alertId: r.alert_id, actorUserId: r.actor_user_id, kind: r.kind, details: r.details, at: r.at };
}

export async function listAlertEvents(db: Db, alertId: string): Promise<AlertEvent[]> {
  const rows = await withDbErrors(() => db<AlertEventRow>("alert_events").select(...EVENT_COLS).where({ alert_id: alertId }).orderBy([{ column: "at" }, { column: "id" }]));
  return rows.map((r) => ({ id: r.id, alertId: r.alert_id, actorUserId: r.actor_user_id, kind: r.kind, details: r.details, at: r.at }));
}

/** E-mail addresses and ids of the organisation's members with one of `roles` (enabled accounts). */
export async function listMemberAddresses(db: Db, organisationId: string, roles: string[]): Promise<{ userId: string; email: string; displayName: string }[]> {
  return withDbErrors(() =>
    db("memberships as m").join("users as u", "u.id", "m.user_id")
      .where("m.organisation_id", organisationId).whereIn("m.role", roles).where("u.disabled", false)
      .select("u.id as userId", "u.email", "u.display_name as displayName").orderBy("u.email"),
  );
}

/** true when the asset has an alert that is not closed (an inspection is asked). */
export async function hasLiveAlert(db: Db, assetId: string): Promise<boolean> {
  const row = await withDbErrors(() => db("alerts").where({ asset_id: assetId }).whereNot({ state: "closed" }).first("id"));
  return Boolean(row);
}
