import fs from "node:fs";
import path from "node:path";
import knexFactory, { type Knex } from "knex";
import { afterAll, describe, expect, it } from "vitest";
import { testKnexConfig } from "../helpers/knex";

// Issue 2, "Checks that must pass": migrations up/down/up on a real cluster. CONVENTIONS §6:
// every migration has `up` and `down`, so rolling everything back leaves no trace and
// migrating again rebuilds exactly the same schema.

const knex: Knex = knexFactory(testKnexConfig());
afterAll(() => knex.destroy());

const MIGRATION_DIR = path.resolve(__dirname, "../../db/migrations");
const BOOKKEEPING = ["knex_migrations", "knex_migrations_lock"];

/** Tables, columns, constraints, indexes and types of the public schema, as sorted text. */
async function schemaSnapshot(): Promise<string[]> {
  const columns = await knex.raw<{ rows: Record<string, string>[] }>(
    `SELECT table_name, column_name, data_type, udt_name, is_nullable, coalesce(column_default, '') AS column_default
       FROM information_schema.columns WHERE table_schema = 'public'`,
  );
  const constraints = await knex.raw<{ rows: Record<string, string>[] }>(
    `SELECT c.conrelid::regclass::text AS tbl, c.conname, pg_get_constraintdef(c.oid) AS def
       FROM pg_constraint c JOIN pg_namespace n ON n.oid = c.connamespace WHERE n.nspname = 'public'`,
  );
  const indexes = await knex.raw<{ rows: Record<string, string>[] }>(
    `SELECT indexname, indexdef FROM pg_indexes WHERE schemaname = 'public'`,
  );
  const types = await knex.raw<{ rows: Record<string, string>[] }>(
    `SELECT t.typname, t.typtype FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
      WHERE n.nspname = 'public' AND t.typtype IN ('e', 'd', 'c') AND t.typrelid = 0`,
  );
  const functions = await knex.raw<{ rows: Record<string, string>[] }>(
    `SELECT p.proname FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace WHERE n.nspname = 'public'`,
  );
  return [
    ...columns.rows.map((r) => `column ${r.table_name}.${r.column_name} ${r.data_type}/${r.udt_name} null=${r.is_nullable} default=${r.column_default}`),
    ...constraints.rows.map((r) => `constraint ${r.tbl} ${r.conname} ${r.def}`),
    ...indexes.rows.map((r) => `index ${r.indexname} ${r.indexdef}`),
    ...types.rows.map((r) => `type ${r.typname} ${r.typtype}`),
    ...functions.rows.map((r) => `function ${r.proname}`),
  ].sort();
}

async function publicTables(): Promise<string[]> {
  const res = await knex.raw<{ rows: { table_name: string }[] }>(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY table_name`,
  );
  return res.rows.map((r) => r.table_name);
}

describe("db/migrations", () => {
  it("export an up and a down function from every file", async () => {
    const files = fs.readdirSync(MIGRATION_DIR).filter((f) => f.endsWith(".ts"));
    expect(files.length).toBeGreaterThan(0);
    for (const f of files) {
      const mod: Record<string, unknown> = await import(path.join(MIGRATION_DIR, f));
      expect({ file: f, up: typeof mod.up, down: typeof mod.down }).toEqual({ file: f, up: "function", down: "function" });
    }
  });

  it("roll back to an empty schema and migrate up again to the very same schema", async () => {
    await knex.migrate.latest();
    const migrated = await schemaSnapshot();
    expect(migrated.length).toBeGreaterThan(0);

    await knex.migrate.rollback(undefined, true);
    expect(await publicTables()).toEqual(BOOKKEEPING);
    const leftover = (await schemaSnapshot()).filter((line) => !BOOKKEEPING.some((t) => line.includes(t)));
    expect(leftover).toEqual([]);

    await knex.migrate.latest();
    expect(await schemaSnapshot()).toEqual(migrated);
  });

  it("take each migration down and up again on its own", async () => {
    const [, pending] = (await knex.migrate.list()) as [unknown[], unknown[]];
    expect(pending).toEqual([]);
    const before = await schemaSnapshot();
    // Walk down one migration at a time to the empty schema, then back up one at a time.
    let steps = 0;
    while (((await knex.migrate.currentVersion()) as string) !== "none") {
      await knex.migrate.down();
      steps++;
    }
    expect(steps).toBe(fs.readdirSync(MIGRATION_DIR).filter((f) => f.endsWith(".ts")).length);
    for (let i = 0; i < steps; i++) await knex.migrate.up();
    expect(await schemaSnapshot()).toEqual(before);
  });
});
