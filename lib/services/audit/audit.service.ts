/**
 * The audit trail: `recordAudit` is called by every service that changes something, inside
 * the same transaction as the change; `listAudit` pages it for admins and engineers.
 */
import { db, type Db } from "@/lib/db/knex";
import { findAuditCursor, insertAuditEntry, listAuditEntries } from "@/lib/db/repos/audit.repo";
import type { Actor, AuditEntry } from "@/lib/domain/types";
import { assertCan, isUuid } from "@/lib/services/authz";

export interface AuditEvent {
  action: string;
  subjectType: string;
  subjectId: string | null;
  details?: Record<string, unknown>;
}

/** Write one audit entry in the actor's organisation (run it in the change's transaction). */
export async function recordAudit(
  trx: Db,
  who: { organisationId: string; userId: string | null },
  event: AuditEvent,
): Promise<void> {
  await insertAuditEntry(trx, {
    organisationId: who.organisationId,
    actorUserId: who.userId,
    action: event.action,
    subjectType: event.subjectType,
    subjectId: event.subjectId,
    details: event.details,
  });
}

/** Newest first, `limit` (1–200, default 50) entries older than the entry `before`. */
export async function listAudit(actor: Actor, opts: { limit?: number; before?: string } = {}): Promise<AuditEntry[]> {
  assertCan(actor, "audit:read");
  const limit = Math.min(Math.max(Math.trunc(opts.limit ?? 50), 1), 200);
  let cursor: { at: Date; id: string } | undefined;
  if (opts.before) {
    cursor = isUuid(opts.before) ? (await findAuditCursor(db(), actor.organisationId, opts.before)) ?? undefined : undefined;
    if (!cursor) return [];
  }
  return listAuditEntries(db(), actor.organisationId, { limit, before: cursor });
}
