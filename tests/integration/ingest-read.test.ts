/**
 * Gateway heartbeats and reading one record: the gateway that sent it and the members of its
 * organisation see it; other gateways, other organisations and anonymous callers do not.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import * as heartbeatRoute from "@/app/api/v1/gateways/heartbeat/route";
import * as recordsRoute from "@/app/api/v1/records/route";
import * as recordRoute from "@/app/api/v1/records/[recordId]/route";
import { closeDb, db } from "@/lib/db/knex";
import { createGateway, revokeGateway } from "@/lib/services/assets/gateway.service";
import { closeRateLimiter } from "@/lib/services/ingest/rate-limit";
import { sessionCookieFor, tokenFor, unique } from "./support/factories";
import { CHANNELS, csvOf, makeGatewayAsset, metaOf, noiseRecord, send, uploadRequest, type GatewaySetup } from "./support/uploads";
import { closeQueues } from "@/lib/jobs/queues";

let g: GatewaySetup;
let foreign: GatewaySetup;
let recordId: string;

beforeAll(async () => {
  [g, foreign] = await Promise.all([makeGatewayAsset(), makeGatewayAsset()]);
  const r = await send(recordsRoute.POST, uploadRequest({ key: g.key, meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(1000, Math.random() * 6)) }));
  expect(r.status).toBe(202);
  recordId = r.body.record!.id;
});
afterAll(async () => {
  await closeQueues();
  await closeRateLimiter();
  await closeDb();
});

const get = (id: string, headers: Record<string, string> = {}) =>
  send(recordRoute.GET, new Request(`http://127.0.0.1/api/v1/records/${id}`, { headers }), { recordId: id });
const bearer = (t: string) => ({ authorization: `Bearer ${t}` });

describe("GET /api/v1/records/:recordId", () => {
  it("answers the gateway that sent the record with its status (no analysis yet)", async () => {
    const r = await get(recordId, bearer(g.key));
    expect(r.status).toBe(200);
    expect(r.body.record).toMatchObject({ id: recordId, status: "queued", gatewayId: g.gatewayId });
    expect(r.body.record).not.toHaveProperty("blobKey");
    expect(r.body.analysis).toBeNull();
  });

  it("answers every role of the organisation, by personal token and by session", async () => {
    for (const role of ["admin", "engineer", "inspector", "owner"] as const) {
      expect((await get(recordId, bearer(await tokenFor(g.team[role])))).status).toBe(200);
    }
    expect((await get(recordId, { cookie: await sessionCookieFor(g.team.inspector) })).status).toBe(200);
  });

  it("answers 404 to another gateway of the same asset, to another organisation and to unknown ids", async () => {
    const other = await createGateway(g.team.admin.actor, g.asset.id, { name: unique("gw") });
    expect((await get(recordId, bearer(other.key))).status).toBe(404);
    expect((await get(recordId, bearer(foreign.key))).status).toBe(404);
    const r = await get(recordId, bearer(await tokenFor(foreign.team.engineer)));
    expect(r.status).toBe(404);
    expect(r.body.error?.code).toBe("not_found");
    expect((await get(randomUUID(), bearer(g.key))).status).toBe(404);
    expect((await get("not-a-uuid", bearer(await tokenFor(g.team.owner)))).status).toBe(404);
  });

  it("answers 401 without credentials and to a revoked gateway key", async () => {
    expect((await get(recordId)).status).toBe(401);
    const extra = await createGateway(g.team.admin.actor, g.asset.id, { name: unique("gw") });
    await revokeGateway(g.team.admin.actor, g.asset.id, extra.gateway.id);
    expect((await get(recordId, bearer(extra.key))).body.error?.code).toBe("unauthorized");
  });
});

describe("POST /api/v1/gateways/heartbeat", () => {
  const beat = (key: string | null, body: unknown) =>
    send(heartbeatRoute.POST, new Request("http://127.0.0.1/api/v1/gateways/heartbeat", {
      method: "POST", headers: { ...(key ? bearer(key) : {}), "content-type": "application/json" }, body: JSON.stringify(body),
    }));

  it("records last seen, firmware and the clock offset (gateway clock minus server clock)", async () => {
    const s = await makeGatewayAsset();
    const before = Date.now();
    const sentAt = new Date(before + 3_600_000).toISOString(); // a gateway one hour fast
    const r = await beat(s.key, { sentAt, firmwareVersion: "lk-gw 2.4.1" });
    const after = Date.now();
    expect(r.status).toBe(200);
    const hb = r.body.heartbeat!;
    // offset = sentAt − receivedAt with receivedAt in [before, after]
    expect(hb.clockOffsetMs).toBeGreaterThanOrEqual(3_600_000 - (after - before));
    expect(hb.clockOffsetMs).toBeLessThanOrEqual(3_600_000);
    expect(hb.firmwareVersion).toBe("lk-gw 2.4.1");
    const row = await db()("gateways").where({ id: s.gatewayId }).first("firmware_version", "clock_offset_ms", "last_seen_at", "last_heartbeat_at");
    expect(row.firmware_version).toBe("lk-gw 2.4.1");
    expect(row.clock_offset_ms).toBe(hb.clockOffsetMs);
    expect(row.last_heartbeat_at.getTime()).toBeGreaterThanOrEqual(before);
    // A heartbeat without firmware keeps the known firmware and clears a stale offset.
    const again = await beat(s.key, {});
    expect(again.body.heartbeat).toMatchObject({ firmwareVersion: "lk-gw 2.4.1", clockOffsetMs: null });
  });

  it("answers 401 without a key or with a personal token, and 422 to unknown or invalid fields", async () => {
    expect((await beat(null, {})).status).toBe(401);
    expect((await beat(await tokenFor(g.team.admin), {})).status).toBe(401);
    const bad = await beat(g.key, { sentAt: "yesterday", battery: 3 });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error?.details.fieldErrors as object)).toEqual(expect.arrayContaining(["sentAt"]));
  });
});
