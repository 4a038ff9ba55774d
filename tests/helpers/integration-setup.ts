/**
 * Vitest globalSetup of the integration project: the services are already running (started by
 * scripts/test.mjs); migrate the test database once to the latest version.
 */
import knexFactory from "knex";
import { testKnexConfig } from "./knex";
import { assertTestStack } from "./guard";

export default async function setup(): Promise<void> {
  assertTestStack();
  const knex = knexFactory(testKnexConfig());
  try {
    await knex.migrate.latest();
  } finally {
    await knex.destroy();
  }
}
