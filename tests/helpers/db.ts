/** Database helpers for integration tests (the test cluster only; see guard.ts). */
import { db } from "@/lib/db/knex";
import { assertTestStack } from "./guard";

const KEEP = new Set(["knex_migrations", "knex_migrations_lock"]);

/** Names of the application tables in the public schema (migration bookkeeping excluded). */
export async function listTables(): Promise<string[]> {
  const rows = await db()
    .select<{ table_name: string }[]>("table_name")
    .from("information_schema.tables")
    .where({ table_schema: "public", table_type: "BASE TABLE" })
    .orderBy("table_name");
  return rows.map((r) => r.table_name).filter((t) => !KEEP.has(t));
}

/** Empty every application table (one TRUNCATE … RESTART IDENTITY CASCADE). */
export async function truncateAll(): Promise<void> {
  assertTestStack();
  const tables = await listTables();
  if (tables.length === 0) return;
  await db().raw(`TRUNCATE TABLE ${tables.map(() => "??").join(", ")} RESTART IDENTITY CASCADE`, tables);
}
