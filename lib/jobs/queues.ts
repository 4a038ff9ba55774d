/**
 * The one queue module (CONVENTIONS §1.4): queue names, payload schemas and enqueue helpers.
 * Producers (services) call `enqueueMail`; consumers (workers/*.worker.ts) parse the payload
 * with the same schema. Job ids are strings without ':' (BullMQ rejects them).
 */
import { randomUUID } from "node:crypto";
import { Queue, type JobsOptions } from "bullmq";
import type { Redis } from "ioredis";
import { z } from "zod";
import { createRedisConnection } from "./connection";

export const QUEUE_NAMES = {
  mail: "mail",
  analysis: "analysis",
  drift: "drift",
  reports: "reports",
} as const;
export type QueueName = (typeof QUEUE_NAMES)[keyof typeof QUEUE_NAMES];

/** A file attached to an e-mail, carried in the job as base64 (a monthly report PDF: tens of kB). */
export const MailAttachment = z.object({
  filename: z.string().min(1).max(200),
  contentType: z.string().min(1).max(200),
  contentBase64: z.string().min(1),
});
export type MailAttachment = z.infer<typeof MailAttachment>;

/** Payload of a `mail` job: one message, already rendered by lib/email/templates. */
export const MailJob = z.object({
  to: z.email(),
  subject: z.string().min(1).max(998),
  text: z.string(),
  html: z.string().optional(),
  attachments: z.array(MailAttachment).max(5).optional(),
});
export type MailJob = z.infer<typeof MailJob>;

/** Retries with exponential backoff (2 s, 4 s, 8 s, ...); finished jobs are trimmed. */
export const DEFAULT_JOB_OPTIONS: JobsOptions = {
  attempts: 5,
  backoff: { type: "exponential", delay: 2000 },
  removeOnComplete: { count: 1000 },
  removeOnFail: { count: 5000 },
};

interface QueueState {
  connection: Redis | null;
  queues: Map<QueueName, Queue>;
}
const globalForQueues = globalThis as unknown as { __modewardenQueues?: QueueState };

function state(): QueueState {
  globalForQueues.__modewardenQueues ??= { connection: null, queues: new Map() };
  return globalForQueues.__modewardenQueues;
}

/**
 * The process-wide producer for a queue (one shared Redis connection for all producers).
 * `defaultJobOptions` applies when the producer is first created: each queue's own module
 * (lib/jobs/analysis.ts, lib/jobs/drift.ts) passes its retry policy.
 */
export function getQueue(name: QueueName, defaultJobOptions: JobsOptions = DEFAULT_JOB_OPTIONS): Queue {
  const s = state();
  let q = s.queues.get(name);
  if (!q) {
    s.connection ??= createRedisConnection();
    q = new Queue(name, { connection: s.connection, defaultJobOptions });
    s.queues.set(name, q);
  }
  return q;
}

/**
 * Queue one e-mail. `jobId` makes the enqueue idempotent (a second call with the same id is
 * ignored by BullMQ); without it a random id is used. Returns the job id.
 */
export async function enqueueMail(message: MailJob, options: { jobId?: string } = {}): Promise<string> {
  const data = MailJob.parse(message);
  const jobId = options.jobId ?? `mail-${randomUUID()}`;
  if (jobId.includes(":")) throw new RangeError(`job ids must not contain ':' (got ${jobId})`);
  const job = await getQueue(QUEUE_NAMES.mail).add("send", data, { jobId });
  return job.id ?? jobId;
}

/** Close every producer and the shared connection (scripts, tests, worker shutdown). */
export async function closeQueues(): Promise<void> {
  const s = state();
  const queues = [...s.queues.values()];
  s.queues.clear();
  await Promise.all(queues.map((q) => q.close()));
  const conn = s.connection;
  s.connection = null;
  if (conn) await conn.quit().catch(() => conn.disconnect());
}
