import type { Db } from "@/lib/db/knex";
import { toApiToken, type ApiTokenRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { ApiToken } from "@/lib/domain/types";

const COLS = ["id", "user_id", "organisation_id", "name", "prefix", "created_at", "last_used_at", "revoked_at"] as const;

export interface ApiTokenRecord extends ApiToken { userId: string; organisationId: string }

const toRecord = (r: ApiTokenRow): ApiTokenRecord => ({ ...toApiToken(r), userId: r.user_id, organisationId: r.organisation_id });

export async function insertApiToken(
  db: Db,
  t: { userId: string; organisationId: string; name: string; tokenHash: string; prefix: string },
): Promise<ApiTokenRecord> {
  const [row] = await withDbErrors(() =>
    db("api_tokens")
      .insert({ user_id: t.userId, organisation_id: t.organisationId, name: t.name, token_hash: t.tokenHash, prefix: t.prefix })
      .returning(COLS),
  );
  return toRecord(row as ApiTokenRow);
}

/** Tokens of one user in one organisation, newest first (revoked ones included). */
export async function listApiTokensOfUser(db: Db, userId: string, organisationId: string): Promise<ApiToken[]> {
  const rows = await withDbErrors(() =>
    db<ApiTokenRow>("api_tokens")
      .select(...COLS)
      .where({ user_id: userId, organisation_id: organisationId })
      .orderBy([{ column: "created_at", order: "desc" }, { column: "id", order: "desc" }]),
  );
  return rows.map(toApiToken);
}

export async function findApiTokenById(db: Db, id: string): Promise<ApiTokenRecord | null> {
  const row = await withDbErrors(() => db<ApiTokenRow>("api_tokens").select(...COLS).where({ id }).first());
  return row ? toRecord(row) : null;
}

export async function findApiTokenByHash(db: Db, tokenHash: string): Promise<ApiTokenRecord | null> {
  const row = await withDbErrors(() => db<ApiTokenRow>("api_tokens").select(...COLS).where("token_hash", tokenHash).first());
  return row ? toRecord(row) : null;
}

export async function revokeApiTokenById(db: Db, id: string): Promise<ApiTokenRecord | null> {
  const [row] = await withDbErrors(() =>
    db("api_tokens").where({ id }).update({ revoked_at: db.raw("coalesce(revoked_at, now())") }).returning(COLS),
  );
  return row ? toRecord(row as ApiTokenRow) : null;
}

export async function touchApiToken(db: Db, id: string, at: Date): Promise<void> {
  await withDbErrors(() => db("api_tokens").where({ id }).update({ last_used_at: at }));
}
