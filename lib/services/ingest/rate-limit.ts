/**
 * Per-gateway upload rate limit in Redis: a fixed one-minute window per gateway
 * (INCR + EXPIRE in one MULTI). Over the limit, the caller answers 429 with Retry-After =
 * the seconds left in the window. Fixed windows allow a burst of up to twice the limit
 * across a window edge [practice]; that is acceptable for a gateway that misbehaves.
 */
import type { Redis } from "ioredis";
import { env } from "@/lib/config/env";
import { createRedisConnection } from "@/lib/jobs/connection";
import { AppError } from "@/lib/http/errors";

const WINDOW_S = 60;
const globalForLimiter = globalThis as unknown as { __modewardenRateRedis?: Redis };

function redis(): Redis {
  globalForLimiter.__modewardenRateRedis ??= createRedisConnection();
  return globalForLimiter.__modewardenRateRedis;
}

/** Thrown when over the limit; the route sets `Retry-After: retryAfterS`. */
export class RateLimitedError extends AppError {
  constructor(readonly retryAfterS: number, limit: number) {
    super("too_many_requests", `More than ${limit} uploads in a minute from this gateway; retry in ${retryAfterS} s.`, {
      details: { rule: "rate_limit", limitPerMinute: limit, retryAfterS },
    });
  }
}

/** Count one upload of `gatewayId` at `now`; throws RateLimitedError past the limit. */
export async function consumeUploadAllowance(gatewayId: string, now = new Date()): Promise<void> {
  const limit = env().UPLOAD_RATE_LIMIT_PER_MINUTE;
  const nowS = Math.floor(now.getTime() / 1000);
  const window = Math.floor(nowS / WINDOW_S);
  const key = `ratelimit:upload:${gatewayId}:${window}`;
  const res = await redis().multi().incr(key).expire(key, WINDOW_S * 2).exec();
  const count = Number(res?.[0]?.[1] ?? 0);
  if (count > limit) throw new RateLimitedError(Math.max(1, (window + 1) * WINDOW_S - nowS), limit);
}

/** Close the limiter's Redis connection (tests, shutdown). */
export async function closeRateLimiter(): Promise<void> {
  const r = globalForLimiter.__modewardenRateRedis;
  globalForLimiter.__modewardenRateRedis = undefined;
  if (r) await r.quit().catch(() => r.disconnect());
}
