import net from "node:net";
import { afterEach, describe, expect, it } from "vitest";
import { GET } from "@/app/api/health/route";
import { resetEnvForTests } from "@/lib/config/env";
import { closeDb } from "@/lib/db/knex";
import pkg from "@/package.json";

// The contract checked here is issue 2's: `GET /api/health` answers
// `200 {"db":"ok","redis":"ok",...}`, and 503 naming the part that fails.

/** A TCP port nothing listens on: bind an ephemeral port, then release it. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

const saved = { PGPORT: process.env.PGPORT, REDIS_PORT: process.env.REDIS_PORT };

afterEach(async () => {
  process.env.PGPORT = saved.PGPORT;
  process.env.REDIS_PORT = saved.REDIS_PORT;
  resetEnvForTests();
  await closeDb();
});

describe("GET /api/health", () => {
  it("answers 200 with db ok and redis ok while PostgreSQL and Redis answer", async () => {
    const before = Date.now();
    const res = await GET();
    const body = await res.json();
    expect(res.status).toBe(200);
    expect(body).toMatchObject({ db: "ok", redis: "ok", version: pkg.version });
    expect(body.errors).toBeUndefined();
    expect(Date.parse(body.time)).toBeGreaterThanOrEqual(before - 1000);
    expect(res.headers.get("cache-control")).toBe("no-store");
  });

  it("answers 503 naming redis when Redis does not answer", async () => {
    process.env.REDIS_PORT = String(await closedPort());
    resetEnvForTests();
    const res = await GET();
    const body = await res.json();
    expect(res.status).toBe(503);
    expect(body).toMatchObject({ db: "ok", redis: "error" });
    expect(Object.keys(body.errors)).toEqual(["redis"]);
  });

  it("answers 503 naming db when PostgreSQL does not answer, without the driver's message", async () => {
    await closeDb();
    process.env.PGPORT = String(await closedPort());
    resetEnvForTests();
    const res = await GET();
    const body = await res.json();
    expect(res.status).toBe(503);
    expect(body).toMatchObject({ db: "error", redis: "ok" });
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED/);
  });
});
