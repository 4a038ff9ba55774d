/**
 * GET /api/health — liveness of the app and its two dependencies, for launchers and
 * monitors. No session needed. 200 {"db":"ok","redis":"ok",...} or 503 naming the failing part.
 */
import { NextResponse } from "next/server";
import { db } from "@/lib/db/knex";
import { createRedisConnection } from "@/lib/jobs/connection";
import pkg from "@/package.json";

/** Rendered per request, never at build time (the build has no database). */
export const dynamic = "force-dynamic";

const TIMEOUT_MS = 2000;

function withTimeout<T>(p: Promise<T>, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`${what} did not answer within ${TIMEOUT_MS} ms`)), TIMEOUT_MS);
  });
  return Promise.race([p, timeout]).finally(() => clearTimeout(timer));
}

async function checkDb(): Promise<void> {
  await withTimeout(db().raw("select 1"), "PostgreSQL");
}

async function checkRedis(): Promise<void> {
  // A short-lived connection: health checks are rare, and a broken shared connection must not
  // hide behind ioredis's reconnect loop.
  const redis = createRedisConnection({ lazyConnect: true, connectTimeoutMs: TIMEOUT_MS });
  redis.on("error", () => {}); // reported through the rejected promise below
  try {
    await withTimeout(
      redis.connect().then(() => redis.ping()),
      "Redis",
    );
  } finally {
    redis.disconnect();
  }
}

type Part = "ok" | "error";

export async function GET(): Promise<NextResponse> {
  const [dbResult, redisResult] = await Promise.allSettled([checkDb(), checkRedis()]);
  const body: { db: Part; redis: Part; version: string; time: string; errors?: Record<string, string> } = {
    db: dbResult.status === "fulfilled" ? "ok" : "error",
    redis: redisResult.status === "fulfilled" ? "ok" : "error",
    version: pkg.version,
    time: new Date().toISOString(),
  };
  const errors: Record<string, string> = {};
  // Only a fixed description per part reaches the client, never a driver message (CONVENTIONS §6).
  if (dbResult.status === "rejected") {
    errors.db = "PostgreSQL is unreachable";
    console.error("health: db", dbResult.reason);
  }
  if (redisResult.status === "rejected") {
    errors.redis = "Redis is unreachable";
    console.error("health: redis", redisResult.reason);
  }
  if (Object.keys(errors).length) body.errors = errors;
  const ok = body.db === "ok" && body.redis === "ok";
  return NextResponse.json(body, { status: ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
