/**
 * Consumer of the `mail` queue: parse the payload with the producer's schema, send it through
 * the SMTP transport. A retry re-sends the same message (SMTP offers nothing to upsert);
 * BullMQ only retries after a failed send, so duplicates need a failure after delivery.
 */
import { Worker, type Job } from "bullmq";
import type { Redis } from "ioredis";
import { MailJob, QUEUE_NAMES } from "@/lib/jobs/queues";
import { sendMail } from "@/lib/email/transport";

export async function processMailJob(job: Job): Promise<{ messageId: string }> {
  const message = MailJob.parse(job.data);
  return sendMail(message);
}

export function createMailWorker(connection: Redis): Worker {
  return new Worker(QUEUE_NAMES.mail, processMailJob, { connection, concurrency: 4 });
}
