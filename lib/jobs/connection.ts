/**
 * Redis connections for BullMQ. Workers block on Redis, so every connection is created with
 * `maxRetriesPerRequest: null` (BullMQ requires it for workers and accepts it for queues).
 */
import { Redis } from "ioredis";
import { env } from "@/lib/config/env";

/** A new connection to REDIS_HOST:REDIS_PORT; the caller closes it (`quit()`). */
export function createRedisConnection(options: { lazyConnect?: boolean; connectTimeoutMs?: number } = {}): Redis {
  const e = env();
  return new Redis({
    host: e.REDIS_HOST,
    port: e.REDIS_PORT,
    maxRetriesPerRequest: null,
    lazyConnect: options.lazyConnect ?? false,
    connectTimeout: options.connectTimeoutMs ?? 10_000,
  });
}
