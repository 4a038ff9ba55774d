/**
 * Knex settings for tests. Knex loads migration and seed files with Node's own `require`,
 * which cannot read TypeScript inside Vitest; these sources load them through Vitest's
 * module runner instead. Names match knex's file-system sources (the file name), so the
 * knex_migrations rows are the same as those `npm run migrate` writes.
 */
import fs from "node:fs";
import path from "node:path";
import type { Knex } from "knex";
import { knexConfig } from "../../knexfile";

const ROOT = path.resolve(__dirname, "../..");
const MIGRATIONS = path.join(ROOT, "db/migrations");
const SEEDS = path.join(ROOT, "db/seeds");

const tsFiles = (dir: string) => (fs.existsSync(dir) ? fs.readdirSync(dir).filter((f) => f.endsWith(".ts")).sort() : []);

const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => tsFiles(MIGRATIONS),
  getMigrationName: (file) => file,
  getMigration: async (file) => (await import(path.join(MIGRATIONS, file))) as Knex.Migration,
};

interface SeedSource {
  getSeeds(): Promise<string[]>;
  getSeed(file: string): Promise<{ seed: (knex: Knex) => Promise<void> }>;
}
const seedSource: SeedSource = {
  getSeeds: async () => tsFiles(SEEDS).map((f) => path.join(SEEDS, f)),
  getSeed: async (file) => (await import(file)) as { seed: (knex: Knex) => Promise<void> },
};

/** knexfile.ts's settings with migrations and seeds loaded through Vitest. */
export function testKnexConfig(): Knex.Config {
  const base = knexConfig();
  return {
    ...base,
    migrations: { tableName: "knex_migrations", migrationSource },
    // knex 3 accepts a custom seedSource; its typings do not list it.
    seeds: { seedSource } as Knex.SeederConfig,
  };
}
