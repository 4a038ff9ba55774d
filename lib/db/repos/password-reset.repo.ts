import type { Db } from "@/lib/db/knex";
import type { PasswordResetRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";

const COLS = ["id", "user_id", "token_hash", "expires_at", "used_at", "created_at"] as const;

export interface PasswordResetRecord { id: string; userId: string; expiresAt: Date; usedAt: Date | null }

const toRecord = (r: PasswordResetRow): PasswordResetRecord => ({
  id: r.id, userId: r.user_id, expiresAt: r.expires_at, usedAt: r.used_at,
});

export async function insertPasswordReset(db: Db, p: { userId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await withDbErrors(() =>
    db("password_resets").insert({ user_id: p.userId, token_hash: p.tokenHash, expires_at: p.expiresAt }),
  );
}

export async function findPasswordResetByTokenHash(db: Db, tokenHash: string): Promise<PasswordResetRecord | null> {
  const row = await withDbErrors(() =>
    db<PasswordResetRow>("password_resets").select(...COLS).where({ token_hash: tokenHash }).first(),
  );
  return row ? toRecord(row) : null;
}

/** Use up every open reset of the user (the used one and any older ones). */
export async function markPasswordResetsUsed(db: Db, userId: string): Promise<void> {
  await withDbErrors(() =>
    db("password_resets").where({ user_id: userId }).whereNull("used_at").update({ used_at: db.fn.now() }),
  );
}
