import { env } from "@/lib/config/env";

/**
 * Integration and e2e helpers truncate tables and clear the mail catcher: refuse to run unless
 * the environment points at the throw-away test stack that scripts/test.mjs starts
 * (PGPORT equal to TEST_PGPORT), so a stray `vitest run` can never wipe the development data.
 */
export function assertTestStack(): void {
  const e = env();
  if (e.PGPORT !== e.TEST_PGPORT || e.REDIS_PORT !== e.TEST_REDIS_PORT) {
    throw new Error(
      `refusing to run against PGPORT=${e.PGPORT}/REDIS_PORT=${e.REDIS_PORT}: integration and e2e tests run on the ` +
        `test stack (PGPORT=${e.TEST_PGPORT}, REDIS_PORT=${e.TEST_REDIS_PORT}): use \`npm test -- --stages=integration\`, ` +
        `or, for throw-away services of your own, set TEST_PGPORT and TEST_REDIS_PORT to their ports as well`,
    );
  }
}
