import type { Db } from "@/lib/db/knex";
import { toAuditEntry, type AuditRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { AuditEntry } from "@/lib/domain/types";

export interface AuditWrite {
  organisationId: string;
  actorUserId: string | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  details?: Record<string, unknown>;
}

export async function insertAuditEntry(db: Db, a: AuditWrite): Promise<void> {
  await withDbErrors(() =>
    db("audit_log").insert({
      organisation_id: a.organisationId,
      actor_user_id: a.actorUserId,
      action: a.action,
      subject_type: a.subjectType,
      subject_id: a.subjectId,
      details: JSON.stringify(a.details ?? {}),
    }),
  );
}

/** Keyset page of an organisation's audit log, newest first; `before` is an entry id. */
export async function listAuditEntries(
  db: Db,
  organisationId: string,
  page: { limit: number; before?: { at: Date; id: string } },
): Promise<AuditEntry[]> {
  const rows = await withDbErrors(() => {
    const q = db("audit_log as l")
      .leftJoin("users as u", "u.id", "l.actor_user_id")
      .select<AuditRow[]>(
        "l.id", "l.organisation_id", "l.actor_user_id", "l.action", "l.subject_type", "l.subject_id", "l.details", "l.at",
        db.raw("coalesce(u.display_name, u.email) as actor_label"),
      )
      .where("l.organisation_id", organisationId)
      .orderBy([{ column: "l.at", order: "desc" }, { column: "l.id", order: "desc" }])
      .limit(page.limit);
    if (page.before) q.whereRaw("(l.at, l.id) < (?, ?)", [page.before.at, page.before.id]);
    return q;
  });
  return rows.map(toAuditEntry);
}

export async function findAuditCursor(db: Db, organisationId: string, id: string): Promise<{ at: Date; id: string } | null> {
  const row = await withDbErrors(() =>
    db("audit_log").select<{ id: string; at: Date }[]>("id", "at").where({ organisation_id: organisationId, id }).first(),
  );
  return row ? { at: row.at, id: row.id } : null;
}
