import type { Db } from "@/lib/db/knex";
import { toOrganisation, type OrganisationRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Organisation } from "@/lib/domain/types";

const COLS = ["id", "name", "time_zone"] as const;

export async function findOrganisationById(db: Db, id: string): Promise<Organisation | null> {
  const row = await withDbErrors(() => db<OrganisationRow>("organisations").select(...COLS).where({ id }).first());
  return row ? toOrganisation(row) : null;
}

export async function insertOrganisation(db: Db, o: { id?: string; name: string; timeZone: string }): Promise<Organisation> {
  const [row] = await withDbErrors(() =>
    db("organisations").insert({ ...(o.id ? { id: o.id } : {}), name: o.name, time_zone: o.timeZone }).returning(COLS),
  );
  return toOrganisation(row as OrganisationRow);
}
