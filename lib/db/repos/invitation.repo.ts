import type { Db } from "@/lib/db/knex";
import { toInvitation, type InvitationRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Invitation } from "@/lib/domain/types";
import type { Role } from "@/lib/auth/permissions";

const COLS = [
  "id", "organisation_id", "email", "role", "token_hash", "invited_by_user_id", "expires_at", "accepted_at",
  "revoked_at", "created_at",
] as const;

export interface InvitationRecord extends Invitation {
  organisationId: string;
  revokedAt: Date | null;
}

const toRecord = (r: InvitationRow): InvitationRecord => ({
  ...toInvitation(r), organisationId: r.organisation_id, revokedAt: r.revoked_at,
});

export async function insertInvitation(
  db: Db,
  i: { organisationId: string; email: string; role: Role; tokenHash: string; invitedByUserId: string; expiresAt: Date },
): Promise<InvitationRecord> {
  const [row] = await withDbErrors(() =>
    db("invitations")
      .insert({
        organisation_id: i.organisationId, email: i.email, role: i.role, token_hash: i.tokenHash,
        invited_by_user_id: i.invitedByUserId, expires_at: i.expiresAt,
      })
      .returning(COLS),
  );
  return toRecord(row as InvitationRow);
}

export async function findInvitationByTokenHash(db: Db, tokenHash: string): Promise<InvitationRecord | null> {
  const row = await withDbErrors(() =>
    db<InvitationRow>("invitations").select(...COLS).where({ token_hash: tokenHash }).first(),
  );
  return row ? toRecord(row) : null;
}

/** Pending (not accepted, not revoked) invitations of an organisation, newest first. */
export async function listPendingInvitations(db: Db, organisationId: string): Promise<Invitation[]> {
  const rows = await withDbErrors(() =>
    db<InvitationRow>("invitations")
      .select(...COLS)
      .where({ organisation_id: organisationId })
      .whereNull("accepted_at")
      .whereNull("revoked_at")
      .orderBy([{ column: "created_at", order: "desc" }, { column: "id", order: "desc" }]),
  );
  return rows.map(toInvitation);
}

/** Revoke the pending invitation to `email` (a new one replaces it). Returns how many. */
export async function revokePendingInvitations(db: Db, organisationId: string, email: string): Promise<number> {
  return withDbErrors(() =>
    db("invitations")
      .where({ organisation_id: organisationId, email })
      .whereNull("accepted_at")
      .whereNull("revoked_at")
      .update({ revoked_at: db.fn.now() }),
  );
}

export async function revokeInvitationById(db: Db, organisationId: string, id: string): Promise<number> {
  return withDbErrors(() =>
    db("invitations")
      .where({ organisation_id: organisationId, id })
      .whereNull("accepted_at")
      .whereNull("revoked_at")
      .update({ revoked_at: db.fn.now() }),
  );
}

/** Mark accepted if still pending; returns false when someone else accepted it first. */
export async function markInvitationAccepted(db: Db, id: string): Promise<boolean> {
  const n = await withDbErrors(() =>
    db("invitations").where({ id }).whereNull("accepted_at").whereNull("revoked_at").update({ accepted_at: db.fn.now() }),
  );
  return n === 1;
}
