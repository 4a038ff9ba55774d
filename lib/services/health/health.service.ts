/**
 * Liveness of the app's two dependencies, for launchers and monitors (GET /api/health).
 * Each check has its own time limit so a hung dependency answers "error", not a hung request.
 */
import { db } from "@/lib/db/knex";
import { pingDatabase } from "@/lib/db/repos/health.repo";
import { createRedisConnection } from "@/lib/jobs/connection";

const TIMEOUT_MS = 2000;

export type HealthPart = "ok" | "error";
export interface HealthReport {
  db: HealthPart;
  redis: HealthPart;
  /** A fixed description per failing part (never a driver message, CONVENTIONS §6). */
  errors: Partial<Record<"db" | "redis", string>>;
}

function withTimeout<T>(p: Promise<T>, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`${what} did not answer within ${TIMEOUT_MS} ms`)), TIMEOUT_MS);
  });
  return Promise.race([p, timeout]).finally(() => clearTimeout(timer));
}

async function checkRedis(): Promise<void> {
  // A short-lived connection: health checks are rare, and a broken shared connection must not
  // hide behind ioredis's reconnect loop.
  const redis = createRedisConnection({ lazyConnect: true, connectTimeoutMs: TIMEOUT_MS });
  redis.on("error", () => {}); // reported through the rejected promise below
  try {
    await withTimeout(redis.connect().then(() => redis.ping()), "Redis");
  } finally {
    redis.disconnect();
  }
}

/** Check PostgreSQL and Redis; failures are logged with their cause and reported by part. */
export async function checkHealth(): Promise<HealthReport> {
  const [dbResult, redisResult] = await Promise.allSettled([withTimeout(pingDatabase(db()), "PostgreSQL"), checkRedis()]);
  const errors: HealthReport["errors"] = {};
  if (dbResult.status === "rejected") {
    errors.db = "PostgreSQL is unreachable";
    console.error("health: db", dbResult.reason);
  }
  if (redisResult.status === "rejected") {
    errors.redis = "Redis is unreachable";
    console.error("health: redis", redisResult.reason);
  }
  return { db: errors.db ? "error" : "ok", redis: errors.redis ? "error" : "ok", errors };
}
