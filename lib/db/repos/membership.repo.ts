import type { Db } from "@/lib/db/knex";
import { toMember, toMembership, type MemberRow, type MembershipRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Member, Membership } from "@/lib/domain/types";
import type { Role } from "@/lib/auth/permissions";

/** Every organisation of a user, by organisation name. */
export async function listMembershipsForUser(db: Db, userId: string): Promise<Membership[]> {
  const rows = await withDbErrors(() =>
    db("memberships as m")
      .join("organisations as o", "o.id", "m.organisation_id")
      .select<MembershipRow[]>("m.organisation_id", "o.name as organisation_name", "m.role")
      .where("m.user_id", userId)
      .orderBy([{ column: "o.name" }, { column: "m.organisation_id" }]),
  );
  return rows.map(toMembership);
}

export async function findMembershipRole(db: Db, userId: string, organisationId: string): Promise<Role | null> {
  const row = await withDbErrors(() =>
    db("memberships").select<{ role: Role }[]>("role").where({ user_id: userId, organisation_id: organisationId }).first(),
  );
  return row ? row.role : null;
}

export async function listMembersOfOrganisation(db: Db, organisationId: string): Promise<Member[]> {
  const rows = await withDbErrors(() =>
    db("memberships as m")
      .join("users as u", "u.id", "m.user_id")
      .select<MemberRow[]>("m.user_id", "u.email", "u.display_name", "m.role", "u.disabled", "m.created_at")
      .where("m.organisation_id", organisationId)
      .orderBy([{ column: "u.display_name" }, { column: "u.email" }]),
  );
  return rows.map(toMember);
}

export async function insertMembership(db: Db, m: { userId: string; organisationId: string; role: Role }): Promise<void> {
  await withDbErrors(() =>
    db("memberships").insert({ user_id: m.userId, organisation_id: m.organisationId, role: m.role }),
  );
}

export async function updateMembershipRole(db: Db, userId: string, organisationId: string, role: Role): Promise<number> {
  return withDbErrors(() =>
    db("memberships").where({ user_id: userId, organisation_id: organisationId }).update({ role }),
  );
}

export async function deleteMembership(db: Db, userId: string, organisationId: string): Promise<number> {
  return withDbErrors(() => db("memberships").where({ user_id: userId, organisation_id: organisationId }).del());
}

/**
 * Admin user ids of an organisation, locking their membership rows so two concurrent
 * demotions cannot both pass the "not the last admin" check (call inside a transaction).
 */
export async function lockAdminIds(db: Db, organisationId: string): Promise<string[]> {
  const rows = await withDbErrors(() =>
    db("memberships")
      .select<{ user_id: string }[]>("user_id")
      .where({ organisation_id: organisationId, role: "admin" })
      .forUpdate(),
  );
  return rows.map((r) => r.user_id);
}
