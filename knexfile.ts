import type { Knex } from "knex";
import { env } from "./lib/config/env";

/** Knex CLI / migration configuration; the running app uses lib/db/knex.ts (same settings). */
export function knexConfig(): Knex.Config {
  const e = env();
  return {
    client: "pg",
    connection: { host: e.PGHOST, port: e.PGPORT, user: e.PGUSER, password: e.PGPASSWORD, database: e.PGDATABASE },
    pool: { min: 0, max: 10 },
    migrations: { directory: "./db/migrations", extension: "ts", tableName: "knex_migrations", loadExtensions: [".ts"] },
    seeds: { directory: "./db/seeds", extension: "ts", loadExtensions: [".ts"] },
  };
}

export default knexConfig;
