/** A mail worker on its own Redis connection for tests that check e-mails in the catcher. */
import { closeDb } from "@/lib/db/knex";
import { closeMailTransport } from "@/lib/email/transport";
import { createRedisConnection } from "@/lib/jobs/connection";
import { closeQueues } from "@/lib/jobs/queues";
import { createMailWorker } from "@/workers/mail.worker";

/** Start the worker; `stop()` closes it, its connection, the producers, SMTP and Knex. */
export function startMailWorker(): { stop: () => Promise<void> } {
  const connection = createRedisConnection();
  const worker = createMailWorker(connection);
  return {
    async stop() {
      await worker.close();
      await connection.quit();
      await closeQueues();
      closeMailTransport();
      await closeDb();
    },
  };
}
