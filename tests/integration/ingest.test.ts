/**
 * The upload contract (PRODUCT.md §Upload contract) through the route handler, on the real
 * PostgreSQL, Redis and filesystem blob store: every answer with its error body, nothing
 * kept from a refused upload, the same record stored once.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash, randomUUID } from "node:crypto";
import * as recordsRoute from "@/app/api/v1/records/route";
import { resetEnvForTests } from "@/lib/config/env";
import { closeDb, db } from "@/lib/db/knex";
import { analysisJobId, getAnalysisQueue } from "@/lib/jobs/analysis";
import { createGateway, revokeGateway } from "@/lib/services/assets/gateway.service";
import { decodeSamples } from "@/lib/services/ingest/decode";
import { closeRateLimiter } from "@/lib/services/ingest/rate-limit";
import { blobStore } from "@/lib/storage";
import { tokenFor, unique } from "./support/factories";
import { closeQueues } from "@/lib/jobs/queues";
import {
  CHANNELS, addTrackedMode, csvOf, f32Of, footprint, gzip, makeGatewayAsset, metaOf, noiseRecord, send, uploadRequest,
  type GatewaySetup,
} from "./support/uploads";

let g: GatewaySetup;
let foreign: GatewaySetup;
const N = 1000; // 10 s at 100 Hz: long enough for the contract (≥ 256 samples), no tracked modes here
// A fresh phase per run: content-addressed blobs of earlier runs must not hide a new write.
const samples = noiseRecord(N, Math.random() * 6);
const csv = csvOf(CHANNELS, samples);

beforeAll(async () => {
  [g, foreign] = await Promise.all([makeGatewayAsset(), makeGatewayAsset()]);
});
afterAll(async () => {
  await closeQueues();
  await closeRateLimiter();
  await closeDb();
});

const upload = (spec: Parameters<typeof uploadRequest>[0]) => send(recordsRoute.POST, uploadRequest({ key: g.key, ...spec }));

/** Runs a refused upload and checks that it left no row, no blob and no job. */
async function refused(spec: Parameters<typeof uploadRequest>[0], status: number, code: string, setup: GatewaySetup = g) {
  const before = await footprint(setup.gatewayId);
  const r = await send(recordsRoute.POST, uploadRequest({ key: setup.key, ...spec }));
  expect(r.status).toBe(status);
  expect(r.body.error?.code).toBe(code);
  expect(typeof r.body.error?.message).toBe("string");
  expect(await footprint(setup.gatewayId)).toEqual(before);
  return r.body.error!;
}

describe("POST /api/v1/records — accepted uploads", () => {
  it("answers 202 to a CSV record, stores its samples once by SHA-256 and queues analyse-<id>", async () => {
    const meta = metaOf();
    const before = await footprint(g.gatewayId);
    const r = await upload({ meta, data: csv });
    expect(r.status).toBe(202);
    const rec = r.body.record!;
    expect(r.headers.get("location")).toBe(`/api/v1/records/${rec.id}`);
    expect(rec).toMatchObject({
      gatewayRecordId: meta.recordId, status: "queued", sampleRateHz: 100, channels: CHANNELS, units: "m/s2",
      temperatureC: 8.5, sampleCount: N, durationS: N / 100, dataFormat: "csv", environment: { windSpeedMps: 3.2, humidityPct: 71 },
    });
    expect(await footprint(g.gatewayId)).toEqual({ rows: before.rows + 1, blobs: before.blobs + 1, jobs: before.jobs + 1 });
    const job = await getAnalysisQueue().getJob(analysisJobId(rec.id));
    expect(job?.data).toEqual({ recordId: rec.id });
    // The stored blob decodes to exactly the samples sent.
    const row = await db()("records").where({ id: rec.id }).first("blob_key", "content_hash");
    expect(row.blob_key).toBe(`sha256/${row.content_hash}`);
    const stored = decodeSamples((await blobStore().get(row.blob_key))!, "csv", CHANNELS);
    // (+0 normalises −0, which CSV writes as "0")
    expect(Array.from(stored.data[2], (v) => v + 0)).toEqual(Array.from(samples[2], (v) => v + 0));
  });

  it("answers 200 with the stored record to the same record again, plain or gzip-compressed, and keeps one copy", async () => {
    const meta = metaOf();
    const first = await upload({ meta, data: csv });
    expect(first.status).toBe(202);
    const after = await footprint(g.gatewayId);
    const again = await upload({ meta, data: csv });
    expect(again.status).toBe(200);
    expect(again.body.record!.id).toBe(first.body.record!.id);
    const zipped = await upload({ meta, data: gzip(csv), filename: "record.csv.gz" });
    expect(zipped.status).toBe(200);
    expect(zipped.body.record!.id).toBe(first.body.record!.id);
    expect(await footprint(g.gatewayId)).toEqual(after);
  });

  it("accepts float32 little-endian data, interleaved, plain and gzip-compressed", async () => {
    const raw = await upload({ meta: metaOf(), data: f32Of(samples), type: "application/octet-stream", filename: "r.f32" });
    expect(raw.status).toBe(202);
    expect(raw.body.record).toMatchObject({ dataFormat: "f32le", sampleCount: N });
    const zipped = await upload({ meta: metaOf({ units: "mg" }), data: gzip(f32Of(samples)), type: "application/octet-stream" });
    expect(zipped.status).toBe(202);
    expect(zipped.body.record).toMatchObject({ dataFormat: "f32le", sampleCount: N, units: "mg" });
    // Same samples as float32: the content hash (of the decompressed data) is the same.
    expect(zipped.body.record!.contentHash).toBe(raw.body.record!.contentHash);
    // …and it is the SHA-256 of those bytes [FIPS 180-4], here from Node's one-shot hash.
    expect(raw.body.record!.contentHash).toBe(createHash("sha256").update(f32Of(samples)).digest("hex"));
    // A gzip file may hold several members, decompressed one after the other [RFC 1952 §2.2]:
    // the same samples again (200), however they were split.
    const plain = f32Of(samples);
    const members = Buffer.concat([gzip(plain.subarray(0, 16 * 7)), gzip(plain.subarray(16 * 7))]);
    const split = await upload({ meta: metaOf({ recordId: raw.body.record!.gatewayRecordId }), data: members, type: "application/octet-stream" });
    expect(split.status).toBe(200);
    expect(split.body.record!.id).toBe(raw.body.record!.id);
    const row = await db()("records").where({ id: raw.body.record!.id }).first("blob_key");
    const stored = decodeSamples((await blobStore().get(row.blob_key))!, "f32le", CHANNELS);
    // float32 rounding: relative error ≤ 2⁻²⁴ (IEEE 754 binary32 unit roundoff).
    stored.data[1].forEach((v, k) => expect(Math.abs(v - samples[1][k])).toBeLessThanOrEqual(Math.abs(samples[1][k]) * 2 ** -24));
  });
});

describe("POST /api/v1/records — refusals keep nothing", () => {
  it("answers 409 to the same recordId with other content", async () => {
    const meta = metaOf();
    expect((await upload({ meta, data: csv })).status).toBe(202);
    const other = csvOf(CHANNELS, noiseRecord(N + 1));
    const err = await refused({ meta, data: other }, 409, "conflict");
    expect(err.details).toMatchObject({ field: "meta.recordId", rule: "record_id_unique" });
  });

  it("answers 400 to malformed bodies: meta not JSON, a missing part, an unknown or repeated part", async () => {
    expect((await refused({ metaText: "{not json", data: csv }, 400, "bad_request")).details).toMatchObject({ field: "meta", rule: "json" });
    expect((await refused({ meta: metaOf() }, 400, "bad_request")).details).toMatchObject({ field: "data", rule: "part_required" });
    expect((await refused({ data: csv }, 400, "bad_request")).details).toMatchObject({ field: "meta", rule: "part_required" });
    expect((await refused({ meta: metaOf(), data: csv, extraParts: [["notes", "x"]] }, 400, "bad_request")).details)
      .toMatchObject({ rule: expect.stringMatching(/unknown_part|parts_limit/) });
    expect((await refused({ metaText: "[1,2]", data: csv }, 400, "bad_request")).details).toMatchObject({ rule: "json_object" });
  });

  it("answers 400 to gzip-looking CSV that does not decompress", async () => {
    const broken = Buffer.concat([gzip(csv).subarray(0, 40)]);
    expect((await refused({ meta: metaOf(), data: broken }, 400, "bad_request")).details).toMatchObject({ rule: "gzip" });
  });

  it("answers 401 without a key, with an unknown or revoked key, or with a personal token", async () => {
    const before = await footprint(g.gatewayId);
    const spec = { meta: metaOf(), data: csv };
    expect((await send(recordsRoute.POST, uploadRequest(spec))).status).toBe(401);
    expect((await send(recordsRoute.POST, uploadRequest({ ...spec, key: "mw_gw_unknownkey" }))).body.error?.code).toBe("unauthorized");
    expect((await send(recordsRoute.POST, uploadRequest({ ...spec, key: await tokenFor(g.team.admin) }))).status).toBe(401);
    const { gateway, key } = await createGateway(g.team.admin.actor, g.asset.id, { name: unique("gw") });
    await revokeGateway(g.team.admin.actor, g.asset.id, gateway.id);
    const revoked = await send(recordsRoute.POST, uploadRequest({ ...spec, key }));
    expect(revoked.status).toBe(401);
    expect(revoked.body.error?.code).toBe("unauthorized");
    expect(await footprint(g.gatewayId)).toEqual(before);
    expect(await footprint(gateway.id)).toMatchObject({ rows: 0 });
  });

  it("answers 403 when the meta names an asset the gateway is not assigned to (another organisation's too)", async () => {
    const err = await refused({ meta: metaOf({ assetId: foreign.asset.id }), data: csv }, 403, "forbidden");
    expect(err.details).toMatchObject({ field: "meta.assetId", rule: "asset_assigned" });
    await refused({ meta: metaOf({ assetId: randomUUID() }), data: csv }, 403, "forbidden");
    // Naming its own asset is fine.
    expect((await upload({ meta: metaOf({ assetId: g.asset.id }), data: csv })).status).toBe(202);
  });

  it("answers 413 past UPLOAD_MAX_BYTES and past UPLOAD_MAX_DECODED_BYTES once decompressed", async () => {
    const saved = { max: process.env.UPLOAD_MAX_BYTES, decoded: process.env.UPLOAD_MAX_DECODED_BYTES };
    try {
      process.env.UPLOAD_MAX_BYTES = "20000";
      process.env.UPLOAD_MAX_DECODED_BYTES = "30000";
      resetEnvForTests();
      const big = csvOf(CHANNELS, noiseRecord(2000)); // ≈ 60 kB
      expect(Buffer.byteLength(big)).toBeGreaterThan(40000);
      expect((await refused({ meta: metaOf(), data: big }, 413, "payload_too_large")).details).toMatchObject({ rule: "max_bytes" });
      const zeros = gzip(`${CHANNELS.join(",")}\n${"0,0,0,0\n".repeat(10000)}`); // 80 kB of text, tiny compressed
      expect(zeros.length).toBeLessThan(20000);
      expect((await refused({ meta: metaOf(), data: zeros }, 413, "payload_too_large")).details).toMatchObject({ rule: "max_decoded_bytes" });
    } finally {
      for (const [k, v] of [["UPLOAD_MAX_BYTES", saved.max], ["UPLOAD_MAX_DECODED_BYTES", saved.decoded]] as const) {
        if (v === undefined) delete process.env[k];
        else process.env[k] = v;
      }
      resetEnvForTests();
    }
  });

  it("answers 415 to a data part that is neither text/csv nor application/octet-stream, and to a non-multipart body", async () => {
    expect((await refused({ meta: metaOf(), data: csv, type: "application/json" }, 415, "unsupported_media_type")).details)
      .toMatchObject({ field: "data", rule: "data_type" });
    const before = await footprint(g.gatewayId);
    const json = new Request("http://127.0.0.1/api/v1/records", {
      method: "POST", headers: { authorization: `Bearer ${g.key}`, "content-type": "application/json" }, body: JSON.stringify(metaOf()),
    });
    const r = await send(recordsRoute.POST, json);
    expect(r.status).toBe(415);
    expect(r.body.error?.details).toMatchObject({ rule: "multipart_required" });
    expect(await footprint(g.gatewayId)).toEqual(before);
  });

  it("answers 422 to invalid content, naming the field and the rule", async () => {
    const header = await refused({ meta: metaOf({ channels: ["F1", "F2", "F4", "F3"] }), data: csv }, 422, "unprocessable");
    expect(header.details).toMatchObject({ field: "data", rule: "channel_mismatch" });
    const unknown = await refused({ meta: metaOf({ channels: ["F1", "F2", "F3", "X9"] }), data: csv.replace("F4", "X9") }, 422, "unprocessable");
    expect(unknown.details).toMatchObject({ field: "meta.channels", rule: "channels_configured", unknown: ["X9"] });
    const ragged = csv.split("\n");
    ragged[17] = ragged[17].split(",").slice(0, 3).join(",");
    expect((await refused({ meta: metaOf(), data: ragged.join("\n") }, 422, "unprocessable")).details)
      .toMatchObject({ rule: "ragged_rows", line: 18 });
    const nan = csv.split("\n");
    nan[5] = "0.1,NaN,0.2,0.3";
    expect((await refused({ meta: metaOf(), data: nan.join("\n") }, 422, "unprocessable")).details)
      .toMatchObject({ rule: "non_finite", line: 6, channel: "F2" });
    const inf = f32Of(samples);
    inf.writeFloatLE(Number.POSITIVE_INFINITY, 4 * 4 * 10 + 4);
    expect((await refused({ meta: metaOf(), data: inf, type: "application/octet-stream" }, 422, "unprocessable")).details)
      .toMatchObject({ rule: "non_finite", sample: 11, channelIndex: 1 });
    expect((await refused({ meta: metaOf(), data: f32Of(samples).subarray(0, 4 * 4 * 300 + 6), type: "application/octet-stream" }, 422, "unprocessable")).details)
      .toMatchObject({ rule: "ragged_rows" });
    // IEEE 754 binary32: exponent bits all ones is ±Infinity or NaN (quiet 0x7fc00000,
    // signalling 0x7f800001, negative 0xffc00000); gzip does not hide them.
    for (const [bits, sample, channel] of [[0x7fc00000, 1, 0], [0x7f800001, 500, 3], [0xff800000, 999, 2], [0xffc00000, 1000, 3]] as const) {
      const bad = f32Of(samples);
      bad.writeUInt32LE(bits, 4 * (4 * (sample - 1) + channel));
      expect((await refused({ meta: metaOf(), data: gzip(bad), type: "application/octet-stream" }, 422, "unprocessable")).details)
        .toMatchObject({ rule: "non_finite", sample, channelIndex: channel });
      // The worker's decoder names the same sample and channel.
      expect(() => decodeSamples(bad, "f32le", CHANNELS)).toThrow(expect.objectContaining({ details: expect.objectContaining({ rule: "non_finite", sample, channelIndex: channel }) }));
    }
    const rate = await refused({ meta: metaOf({ sampleRateHz: 5 }), data: csv }, 422, "unprocessable");
    expect(rate.details.fieldErrors).toHaveProperty(["meta.sampleRateHz"]);
    const units = await refused({ meta: metaOf({ units: "cm/s2", extra: 1 }), data: csv }, 422, "unprocessable");
    expect(Object.keys(units.details.fieldErrors as object)).toEqual(expect.arrayContaining(["meta.units", "meta"]));
    expect((await refused({ meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(200)) }, 422, "unprocessable")).details)
      .toMatchObject({ rule: "too_short", samples: 200 });
  });

  it("answers 422 to a record too short for the lowest tracked mode (105 periods of its lower band edge)", async () => {
    const s = await makeGatewayAsset();
    await addTrackedMode(s.asset.id, "first sway", 2.0, 0.1, null);
    // 105 periods of 1.8 Hz = 58.3 s [practice rule in ingest.service.ts]; 50 s is too short, 60 s enough.
    const short = await refused({ meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(5000)) }, 422, "unprocessable", s);
    expect(short.details).toMatchObject({ rule: "too_short" });
    expect(short.details.minDurationS).toBeCloseTo(105 / 1.8, 6);
    const ok = await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(6000)) }));
    expect(ok.status).toBe(202);
  });
});

describe("POST /api/v1/records — rate limit", () => {
  it("answers 429 with Retry-After once a gateway passes its uploads per minute, and keeps nothing", async () => {
    const s = await makeGatewayAsset();
    const saved = process.env.UPLOAD_RATE_LIMIT_PER_MINUTE;
    process.env.UPLOAD_RATE_LIMIT_PER_MINUTE = "1";
    resetEnvForTests();
    try {
      expect((await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csv }))).status).toBe(202);
      // Fill the current and the next window so the check does not depend on the clock.
      const { Redis } = await import("ioredis");
      const { env } = await import("@/lib/config/env");
      const r = new Redis({ host: env().REDIS_HOST, port: env().REDIS_PORT });
      const w = Math.floor(Date.now() / 60000);
      await r.set(`ratelimit:upload:${s.gatewayId}:${w}`, "5", "EX", 120);
      await r.set(`ratelimit:upload:${s.gatewayId}:${w + 1}`, "5", "EX", 180);
      await r.quit();
      const before = await footprint(s.gatewayId);
      const res = await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csv }));
      expect(res.status).toBe(429);
      expect(res.body.error).toMatchObject({ code: "too_many_requests", details: { rule: "rate_limit", limitPerMinute: 1 } });
      const retry = Number(res.headers.get("retry-after"));
      expect(retry).toBeGreaterThanOrEqual(1);
      expect(retry).toBeLessThanOrEqual(60);
      expect(await footprint(s.gatewayId)).toEqual(before);
    } finally {
      if (saved === undefined) delete process.env.UPLOAD_RATE_LIMIT_PER_MINUTE;
      else process.env.UPLOAD_RATE_LIMIT_PER_MINUTE = saved;
      resetEnvForTests();
    }
  });
});
