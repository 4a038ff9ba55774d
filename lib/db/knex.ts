import knexFactory, { type Knex } from "knex";
import { env } from "../config/env";

/**
 * The single Knex instance of the process. Created lazily so importing a module never
 * opens a connection; timestamps come back as Date (timestamptz, stored in UTC).
 */
const globalForKnex = globalThis as unknown as { __modewardenKnex?: Knex };

export function db(): Knex {
  if (!globalForKnex.__modewardenKnex) {
    const e = env();
    globalForKnex.__modewardenKnex = knexFactory({
      client: "pg",
      connection: { host: e.PGHOST, port: e.PGPORT, user: e.PGUSER, password: e.PGPASSWORD, database: e.PGDATABASE },
      pool: { min: 0, max: 10 },
    });
  }
  return globalForKnex.__modewardenKnex;
}

/** Close the pool (workers on SIGTERM, scripts, tests). */
export async function closeDb(): Promise<void> {
  const k = globalForKnex.__modewardenKnex;
  globalForKnex.__modewardenKnex = undefined;
  if (k) await k.destroy();
}

/** A query runner: the shared instance or an open transaction. Repos accept either. */
export type Db = Knex | Knex.Transaction;
