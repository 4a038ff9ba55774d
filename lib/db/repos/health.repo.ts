import type { Db } from "../knex";

/** One round trip to PostgreSQL (health checks). */
export async function pingDatabase(db: Db): Promise<void> {
  await db.raw("select 1");
}
