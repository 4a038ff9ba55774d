/**
 * The alert lifecycle (PRODUCT.md): open → acknowledged → inspection_scheduled → closed with
 * an outcome and findings. Everyone in the organisation reads; inspectors, engineers and
 * admins work alerts (`alert:work`: acknowledge, schedule, assign an inspector, comment) and
 * close them (`alert:close`); owners only read. Every step writes an alert event and an
 * audit entry in the same transaction. A closed alert changes no more (comments excepted).
 * Closing queues a drift replay so the asset's condition follows (`alert` only while an alert
 * is not closed: see conditionWithAlerts). E-mails skip members who muted the asset.
 */
import { db, type Db } from "@/lib/db/knex";
import {
  findAlertById, insertAlertEvent, listAlertEvents, listAlertsOfOrganisation, listMemberAddresses, updateAlertById, type AlertPatch, type AlertWithAsset,
} from "@/lib/db/repos/alert.repo";
import { findMembershipRole } from "@/lib/db/repos/membership.repo";
import { findUserById } from "@/lib/db/repos/user.repo";
import { env } from "@/lib/config/env";
import { alertUpdateEmail, type AlertUpdateEmailData } from "@/lib/email/templates/alert-update";
import { enqueueMail } from "@/lib/jobs/queues";
import type { AlertEvent, AlertEventKind, AlertState } from "@/lib/domain/drift";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { enqueueDrift } from "@/lib/jobs/drift";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, assertSameOrg, isUuid } from "@/lib/services/authz";
import { withoutMutedRecipients } from "@/lib/services/accounts/notification.service";
import { evidenceSummaryLines, readEvidence } from "./evidence";
import {
  ListAlertsQuery, type AssignAlertInput, type CloseAlertInput, type CommentAlertInput, type ScheduleInspectionInput,
} from "./schemas";

export type AlertView = AlertWithAsset;

/** Alerts of the organisation, not closed first, newest first; filters by asset, state, assignee. */
export async function listAlerts(actor: Actor, filter: ListAlertsQuery = {}): Promise<AlertView[]> {
  assertCan(actor, "portfolio:read");
  const f = ListAlertsQuery.parse(filter);
  return listAlertsOfOrganisation(db(), actor.organisationId, f);
}

/** One alert with its history (events oldest first). */
export async function getAlert(actor: Actor, alertId: string): Promise<{ alert: AlertView; events: AlertEvent[] }> {
  assertCan(actor, "portfolio:read");
  const alert = await loadOwnAlert(actor, alertId, db());
  return { alert, events: await listAlertEvents(db(), alert.id) };
}

export async function acknowledgeAlert(actor: Actor, alertId: string): Promise<AlertView> {
  assertCan(actor, "alert:work");
  return step(actor, alertId, "acknowledged", (a) => {
    if (a.state !== "open") throw conflict(a.state, "acknowledged");
    return { patch: { state: "acknowledged" }, details: {} };
  });
}

export async function scheduleInspection(actor: Actor, alertId: string, input: ScheduleInspectionInput): Promise<AlertView> {
  assertCan(actor, "alert:work");
  return step(actor, alertId, "inspection_scheduled", (a) => {
    if (a.state === "closed") throw conflict(a.state, "scheduled");
    return { patch: { state: "inspection_scheduled", inspectionAt: input.at }, details: { at: input.at.toISOString(), note: input.note ?? null } };
  });
}

/** Assign the alert to an inspector of the organisation. */
export async function assignAlert(actor: Actor, alertId: string, input: AssignAlertInput): Promise<AlertView> {
  assertCan(actor, "alert:work");
  const role = await findMembershipRole(db(), input.userId, actor.organisationId);
  if (role !== "inspector") {
    throw new AppError("unprocessable", "Choose an inspector of your organisation.", { fieldErrors: { userId: ["Choose an inspector of your organisation."] } });
  }
  const assigned = await step(actor, alertId, "assigned", (a) => {
    if (a.state === "closed") throw conflict(a.state, "assigned");
    return { patch: { assigneeUserId: input.userId }, details: { userId: input.userId, previousUserId: a.assigneeUserId } };
  });
  const assignee = await findUserById(db(), input.userId);
  if (assignee && !assignee.disabled && assignee.id !== actor.userId) {
    await notify(actor, assigned, { kind: "assigned" }, [{ userId: assignee.id, email: assignee.email }]);
  }
  return assigned;
}

export async function commentOnAlert(actor: Actor, alertId: string, input: CommentAlertInput): Promise<AlertEvent> {
  assertCan(actor, "alert:work");
  return db().transaction(async (trx) => {
    const alert = await loadOwnAlert(actor, alertId, trx, true);
    const event = await insertAlertEvent(trx, { alertId: alert.id, actorUserId: actor.userId, kind: "comment", details: { text: input.text } });
    await recordAudit(trx, actor, { action: "alert.comment", subjectType: "alert", subjectId: alert.id, details: { assetId: alert.assetId } });
    return event;
  });
}

/** Close with an outcome and findings; the asset's drift is replayed afterwards. */
export async function closeAlert(actor: Actor, alertId: string, input: CloseAlertInput): Promise<AlertView> {
  assertCan(actor, "alert:close");
  const closed = await step(actor, alertId, "closed", (a) => {
    if (a.state === "closed") throw conflict(a.state, "closed");
    return { patch: { state: "closed", outcome: input.outcome, findings: input.findings, closedAt: new Date() }, details: { outcome: input.outcome, findings: input.findings } };
  });
  await enqueueDrift(closed.assetId);
  const recipients = await listMemberAddresses(db(), actor.organisationId, ["inspector", "engineer"]);
  await notify(actor, closed, { kind: "closed", outcome: input.outcome, findings: input.findings }, recipients.filter((r) => r.userId !== actor.userId));
  return closed;
}

/**
 * Queue one e-mail per recipient who has not muted the asset (job ids keyed by alert, step
 * and user, so a retry sends nothing twice).
 */
async function notify(
  actor: Actor, alert: AlertView, what: Pick<AlertUpdateEmailData, "kind" | "outcome" | "findings">, recipients: { userId: string; email: string }[],
): Promise<void> {
  const to = await withoutMutedRecipients(db(), alert.assetId, recipients);
  if (to.length === 0) return;
  const me = await findUserById(db(), actor.userId);
  const message = alertUpdateEmail({
    ...what, assetName: alert.assetName, raisedAt: alert.raisedAt, actorName: me?.displayName ?? "A colleague",
    evidence: evidenceSummaryLines(readEvidence(alert.evidence)),
    link: `${env().APP_URL.replace(/\/$/, "")}/alerts/${alert.id}`,
  });
  const stamp = alert.updatedAt.getTime();
  for (const r of to) await enqueueMail({ to: r.email, ...message }, { jobId: `alert-${what.kind}-${alert.id}-${stamp}-${r.userId}` });
}

const conflict = (state: AlertState, verb: string) =>
  new AppError("conflict", `An alert in state ${state} cannot be ${verb}.`, { details: { state } });

async function loadOwnAlert(actor: Actor, alertId: string, q: Db, forUpdate = false): Promise<AlertWithAsset> {
  const alert = isUuid(alertId) ? await findAlertById(q, alertId, { forUpdate }) : null;
  assertSameOrg(actor, alert, "alert");
  return alert;
}

/** One lifecycle step in a transaction: lock, check, update, event, audit. */
async function step(
  actor: Actor, alertId: string, kind: AlertEventKind,
  decide: (a: AlertWithAsset) => { patch: AlertPatch; details: Record<string, unknown> },
): Promise<AlertView> {
  return db().transaction(async (trx) => {
    const alert = await loadOwnAlert(actor, alertId, trx, true);
    const { patch, details } = decide(alert);
    const updated = await updateAlertById(trx, alert.id, patch);
    if (!updated) throw new AppError("not_found", "No such alert.");
    await insertAlertEvent(trx, { alertId: alert.id, actorUserId: actor.userId, kind, details });
    await recordAudit(trx, actor, {
      action: `alert.${kind}`, subjectType: "alert", subjectId: alert.id, details: { assetId: alert.assetId, from: alert.state, ...details },
    });
    return { ...alert, ...updated };
  });
}
