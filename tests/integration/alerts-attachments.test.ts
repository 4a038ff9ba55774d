/**
 * Alert attachments (issue 5): photos (JPEG, PNG, WebP) and PDFs, decided from their first
 * bytes; another type, a type that does not match the content or a file above 10 MiB is
 * refused naming the rule, and leaves no blob; the file is served back with its type to the
 * organisation only (404 elsewhere); owners read but do not attach; each upload is an alert
 * event and an audit entry. Signatures: JPEG SOI FF D8 FF (ISO/IEC 10918-1), PNG (RFC 2083
 * §3.1), WebP RIFF/WEBP (RFC 9649 §2), PDF "%PDF-" (ISO 32000-1 §7.5.2).
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as attachmentsRoute from "@/app/api/v1/alerts/[alertId]/attachments/route";
import * as attachmentRoute from "@/app/api/v1/alerts/[alertId]/attachments/[attachmentId]/route";
import { env } from "@/lib/config/env";
import { closeDb, db } from "@/lib/db/knex";
import { insertAlertIfNew } from "@/lib/db/repos/alert.repo";
import type { Alert } from "@/lib/domain/drift";
import { getAlert } from "@/lib/services/alerts/alert.service";
import { ATTACHMENT_MAX_BYTES, addAlertAttachment } from "@/lib/services/alerts/attachment.service";
import { createAsset } from "@/lib/services/assets/asset.service";
import { blobRoot } from "@/lib/storage";
import { makeTeam, tokenFor, validAsset } from "./support/factories";

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
});
afterAll(async () => {
  await closeDb();
});

// A 1×1 PNG (signature, IHDR, IDAT, IEND) and the leading bytes of the other accepted kinds.
const PNG = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");
const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0xff, 0xd9]);
const WEBP = Buffer.concat([Buffer.from("RIFF"), Buffer.from([0x1a, 0, 0, 0]), Buffer.from("WEBPVP8L"), Buffer.alloc(14)]);
const PDF = Buffer.from("%PDF-1.4\n%findings\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");
const GIF = Buffer.from("GIF89a\u0001\u0000\u0001\u0000\u0000\u0000\u0000;", "latin1");

async function raise(): Promise<Alert> {
  const asset = await createAsset(team.engineer.actor, validAsset());
  const alert = await insertAlertIfNew(db(), { assetId: asset.id, raisedAt: new Date(Date.UTC(2025, 8, 1)), evidence: { rule: "test" } });
  if (!alert) throw new Error("alert not inserted");
  return alert;
}

async function upload(alertId: string, token: string | undefined, file: Buffer, name: string, type: string) {
  const form = new FormData();
  form.set("file", new Blob([new Uint8Array(file)], { type }), name);
  const headers: Record<string, string> = token ? { authorization: `Bearer ${token}` } : {};
  const req = new Request(`http://127.0.0.1/api/v1/alerts/${alertId}/attachments`, { method: "POST", headers, body: form });
  const res = await attachmentsRoute.POST(req, { params: Promise.resolve({ alertId }) });
  return { status: res.status, body: (await res.json()) as { attachment?: { id: string; contentType: string; filename: string }; error?: { message: string } } };
}

async function download(alertId: string, attachmentId: string, token: string) {
  const req = new Request(`http://127.0.0.1/api/v1/alerts/${alertId}/attachments/${attachmentId}`, { headers: { authorization: `Bearer ${token}` } });
  return attachmentRoute.GET(req, { params: Promise.resolve({ alertId, attachmentId }) });
}

/** Names of the files under the alert's attachment folder of the filesystem blob store (the test stack's driver). */
function blobsOf(alertId: string): string[] {
  const dir = path.join(blobRoot(), "alert-attachments", alertId);
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).map((d) => d.name);
}

describe("alert attachments", () => {
  it("accept JPEG, PNG and WebP photos and PDFs, serve them back with their type, and record each upload", async () => {
    expect(env().STORAGE_DRIVER).toBe("fs");
    const a = await raise();
    const token = await tokenFor(team.inspector);
    const cases: [Buffer, string, string][] = [
      [PNG, "east-bearing.png", "image/png"], [JPEG, "deck.jpg", "image/jpeg"], [WEBP, "cable.webp", "image/webp"], [PDF, "report.pdf", "application/pdf"],
    ];
    for (const [bytes, name, type] of cases) {
      const res = await upload(a.id, token, bytes, name, type);
      expect(res.status).toBe(201);
      expect(res.body.attachment).toMatchObject({ filename: name, contentType: type });
      const ownerToken = await tokenFor(team.owner);
      const got = await download(a.id, res.body.attachment!.id, ownerToken);
      expect(got.status).toBe(200);
      expect(got.headers.get("content-type")).toBe(type);
      expect(Buffer.from(await got.arrayBuffer()).equals(bytes)).toBe(true);
    }
    // An undeclared type (octet-stream) is decided from the content.
    const sniffed = await upload(a.id, token, PNG, "photo", "application/octet-stream");
    expect(sniffed.body.attachment?.contentType).toBe("image/png");
    expect(blobsOf(a.id)).toHaveLength(5);

    const { events } = await getAlert(team.owner.actor, a.id);
    expect(events.filter((e) => e.kind === "attachment")).toHaveLength(5);
    const audits = await db()("audit_log").where({ subject_id: a.id, action: "alert.attachment" }).count<{ c: string }[]>({ c: "*" });
    expect(audits).toEqual([{ c: "5" }]);
  });

  it("refuse another type, a declared type that the content contradicts, an empty file and a file above 10 MiB, leaving no blob", async () => {
    const a = await raise();
    const token = await tokenFor(team.engineer);
    const gif = await upload(a.id, token, GIF, "photo.gif", "image/gif");
    expect(gif.status).toBe(415);
    expect(gif.body.error?.message).toMatch(/JPEG, PNG or WebP photos and PDF/);
    const disguised = await upload(a.id, token, GIF, "photo.png", "image/png"); // name and type say PNG, the bytes do not
    expect(disguised.status).toBe(415);
    const mismatch = await upload(a.id, token, PDF, "scan.jpg", "image/jpeg");
    expect(mismatch.status).toBe(415);
    expect(mismatch.body.error?.message).toMatch(/declared as image\/jpeg but its content is a PDF document/);
    expect((await upload(a.id, token, Buffer.alloc(0), "empty.png", "image/png")).status).toBe(400);
    const big = Buffer.concat([PNG, Buffer.alloc(ATTACHMENT_MAX_BYTES + 1 - PNG.length)]);
    const tooBig = await upload(a.id, token, big, "huge.png", "image/png");
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error?.message).toMatch(/10 MiB limit/);
    // Exactly at the limit is accepted (the rule is "larger than 10 MiB").
    const atLimit = await addAlertAttachment(team.engineer.actor, a.id, { filename: "limit.png", declaredType: "image/png", bytes: big.subarray(0, ATTACHMENT_MAX_BYTES) });
    expect(atLimit.sizeBytes).toBe(ATTACHMENT_MAX_BYTES);
    expect(blobsOf(a.id)).toEqual([atLimit.id]);
    expect(await db()("alert_attachments").where({ alert_id: a.id }).count<{ c: string }[]>({ c: "*" })).toEqual([{ c: "1" }]);
  });

  it("answer 401 without credentials, 403 to an owner, 404 to another organisation and for unknown ids, 422 without a file", async () => {
    const a = await raise();
    const [owner, inspector, other] = await Promise.all([tokenFor(team.owner), tokenFor(team.inspector), tokenFor(foreign.inspector)]);
    expect((await upload(a.id, undefined, PNG, "x.png", "image/png")).status).toBe(401);
    expect((await upload(a.id, owner, PNG, "x.png", "image/png")).status).toBe(403);
    expect((await upload(a.id, other, PNG, "x.png", "image/png")).status).toBe(404);
    expect(blobsOf(a.id)).toEqual([]);
    const ok = await upload(a.id, inspector, PNG, "x.png", "image/png");
    expect(ok.status).toBe(201);
    expect((await download(a.id, ok.body.attachment!.id, other)).status).toBe(404);
    const otherAlert = await raise();
    expect((await download(otherAlert.id, ok.body.attachment!.id, inspector)).status).toBe(404); // id of another alert
    expect((await download(a.id, "not-a-uuid", inspector)).status).toBe(404);
    const empty = new Request(`http://127.0.0.1/api/v1/alerts/${a.id}/attachments`, { method: "POST", headers: { authorization: `Bearer ${inspector}` }, body: new FormData() });
    expect((await attachmentsRoute.POST(empty, { params: Promise.resolve({ alertId: a.id }) })).status).toBe(422);
  });
});
