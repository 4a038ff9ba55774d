/**
 * Run the Knex seeds (db/seeds, alphabetical; each is idempotent) with knexfile.ts's settings.
 *   tsx scripts/seed.ts                     run every seed
 *   tsx scripts/seed.ts --print-demo-users  print the demo sign-ins as one JSON line
 *                                           (`DEMO_USERS <json>`) for the launcher
 */
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import knexFactory from "knex";
import { z } from "zod";
import { knexConfig } from "../knexfile";
import { closeDb } from "../lib/db/knex";
import { closeQueues } from "../lib/jobs/queues";

const DemoUser = z.object({ email: z.string(), password: z.string(), role: z.string() }).loose();
const DemoUsers = z.array(DemoUser).min(1);

/** The demo sign-ins, from the first array of {email, password, role} a seed module exports. */
async function findDemoUsers(): Promise<z.infer<typeof DemoUsers> | null> {
  const dir = path.resolve(__dirname, "../db/seeds");
  if (!fs.existsSync(dir)) return null;
  const files = fs.readdirSync(dir).filter((f) => /demo.*\.ts$/.test(f)).sort();
  for (const f of files) {
    const mod: Record<string, unknown> = await import(pathToFileURL(path.join(dir, f)).href);
    for (const value of Object.values(mod)) {
      const parsed = DemoUsers.safeParse(value);
      if (parsed.success) return parsed.data;
    }
  }
  return null;
}

async function main(): Promise<void> {
  if (process.argv.includes("--print-demo-users")) {
    console.log(`DEMO_USERS ${JSON.stringify(await findDemoUsers())}`);
    return;
  }
  const config = knexConfig();
  const seedDir = path.resolve(__dirname, "..", "db", "seeds");
  if (!fs.existsSync(seedDir) || !fs.readdirSync(seedDir).some((f) => f.endsWith(".ts"))) {
    console.log("seeds: none found");
    return;
  }
  const knex = knexFactory(config);
  try {
    const [files] = (await knex.seed.run()) as [string[]];
    console.log(files.length ? `seeded: ${files.map((f) => path.basename(f)).join(", ")}` : "seeds: none found");
  } finally {
    await knex.destroy();
    // The demo seed goes through services (baseline fit, drift replay, alert e-mails), which
    // open the shared Knex pool and queue connections: close them so the script exits.
    await closeQueues();
    await closeDb();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? (err.stack ?? err.message) : err);
  process.exit(1);
});
