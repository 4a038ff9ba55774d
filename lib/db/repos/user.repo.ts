import type { Db } from "@/lib/db/knex";
import type { UserRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";

const COLS = ["id", "email", "password_hash", "display_name", "disabled", "created_at", "updated_at"] as const;

/** A user with the password hash (services only; never leaves lib/services). */
export interface UserRecord {
  id: string;
  email: string;
  passwordHash: string;
  displayName: string;
  disabled: boolean;
}

const toUserRecord = (r: UserRow): UserRecord => ({
  id: r.id, email: r.email, passwordHash: r.password_hash, displayName: r.display_name, disabled: r.disabled,
});

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserByEmail(db: Db, email: string): Promise<UserRecord | null> {
  const row = await withDbErrors(() =>
    db<UserRow>("users").select(...COLS).where({ email: normaliseEmail(email) }).first(),
  );
  return row ? toUserRecord(row) : null;
}

export async function findUserById(db: Db, id: string): Promise<UserRecord | null> {
  const row = await withDbErrors(() => db<UserRow>("users").select(...COLS).where({ id }).first());
  return row ? toUserRecord(row) : null;
}

export async function insertUser(
  db: Db,
  u: { id?: string; email: string; passwordHash: string; displayName: string },
): Promise<UserRecord> {
  const [row] = await withDbErrors(() =>
    db("users")
      .insert({
        ...(u.id ? { id: u.id } : {}),
        email: normaliseEmail(u.email),
        password_hash: u.passwordHash,
        display_name: u.displayName,
      })
      .returning(COLS),
  );
  return toUserRecord(row as UserRow);
}

export async function updateUserPassword(db: Db, id: string, passwordHash: string): Promise<void> {
  await withDbErrors(() => db("users").where({ id }).update({ password_hash: passwordHash, updated_at: db.fn.now() }));
}

export async function updateUserDisplayName(db: Db, id: string, displayName: string): Promise<void> {
  await withDbErrors(() => db("users").where({ id }).update({ display_name: displayName, updated_at: db.fn.now() }));
}
