/**
 * GET /api/health — liveness of the app and its two dependencies, for launchers and
 * monitors. No session needed. 200 {"db":"ok","redis":"ok",...} or 503 naming the failing part.
 */
import { NextResponse } from "next/server";
import { checkHealth, type HealthPart } from "@/lib/services/health/health.service";
import pkg from "@/package.json";

/** Rendered per request, never at build time (the build has no database). */
export const dynamic = "force-dynamic";

export async function GET(): Promise<NextResponse> {
  const report = await checkHealth();
  const body: { db: HealthPart; redis: HealthPart; version: string; time: string; errors?: Record<string, string> } = {
    db: report.db,
    redis: report.redis,
    version: pkg.version,
    time: new Date().toISOString(),
  };
  if (Object.keys(report.errors).length) body.errors = report.errors;
  const ok = body.db === "ok" && body.redis === "ok";
  return NextResponse.json(body, { status: ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
