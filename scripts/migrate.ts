/**
 * Run the Knex migrations with knexfile.ts's settings.
 *   tsx scripts/migrate.ts            migrate to the latest version
 *   tsx scripts/migrate.ts rollback   roll back the last batch
 *   tsx scripts/migrate.ts down-all   roll back every migration
 */
import knexFactory from "knex";
import { knexConfig } from "../knexfile";

async function main(): Promise<void> {
  const command = process.argv[2] ?? "latest";
  const knex = knexFactory(knexConfig());
  try {
    if (command === "latest") {
      const [batch, names] = (await knex.migrate.latest()) as [number, string[]];
      console.log(names.length ? `migrated (batch ${batch}): ${names.join(", ")}` : "migrations: already up to date");
    } else if (command === "rollback" || command === "down-all") {
      const [batch, names] = (await knex.migrate.rollback(undefined, command === "down-all")) as [number, string[]];
      console.log(names.length ? `rolled back (batch ${batch}): ${names.join(", ")}` : "nothing to roll back");
    } else {
      throw new Error(`unknown command ${command} (latest | rollback | down-all)`);
    }
  } finally {
    await knex.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
