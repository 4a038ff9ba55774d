/** Reads of the monthly report job (issue 6 part 4): which organisations have owners to write to. */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

/** Ids of organisations with at least one enabled member of role owner, in id order. */
export async function listOrganisationIdsWithOwners(db: Db): Promise<string[]> {
  const rows = await withDbErrors(() =>
    db("memberships as m").join("users as u", "u.id", "m.user_id")
      .where("m.role", "owner").where("u.disabled", false)
      .distinct("m.organisation_id").orderBy("m.organisation_id"),
  );
  return (rows as { organisation_id: string }[]).map((r) => r.organisation_id);
}
