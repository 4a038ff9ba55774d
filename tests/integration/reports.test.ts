/**
 * Asset reports (issue 6 part 4) on a simulated history with a 2 % stiffness loss and the
 * open alert it raises: the PDF holds the owners' summary, the alert, the caution and the
 * trend images (read back with poppler's pdftotext and pdfimages); the report route answers
 * 401/404/422; the modal-history CSV matches its data dictionary; the monthly run sends one
 * e-mail per owner, nobody else, with the PDF attached.
 */
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { Queue, type Worker } from "bullmq";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as reportRoute from "@/app/api/v1/assets/[assetId]/report/route";
import * as csvRoute from "@/app/api/v1/assets/[assetId]/export/modal-history.csv/route";
import * as dictRoute from "@/app/api/v1/assets/[assetId]/export/data-dictionary/route";
import { closeDb } from "@/lib/db/knex";
import type { Asset } from "@/lib/domain/types";
import { closeMailTransport } from "@/lib/email/transport";
import { createRedisConnection } from "@/lib/jobs/connection";
import { closeQueues } from "@/lib/jobs/queues";
import { REPORT_CAUTION } from "@/lib/reports/caution";
import { MODAL_HISTORY_DICTIONARY } from "@/lib/reports/modal-history-csv";
import { createAsset } from "@/lib/services/assets/asset.service";
import { fitAndActivateBaseline } from "@/lib/services/drift/baseline.service";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { MONTHLY_CRON, REPORTS_QUEUE, scheduleMonthlyReports } from "@/lib/services/reports/monthly-schedule";
import { sendMonthlyReports } from "@/lib/services/reports/monthly.service";
import { renderAssetReport } from "@/lib/services/reports/report-pdf.service";
import { simulateDriftHistory } from "@/lib/stats/drift-simulation";
import { caughtMails, clearMails, waitForMail } from "@/tests/helpers/mail";
import { createMailWorker } from "@/workers/mail.worker";
import { makeMember, makeTeam, tokenFor, validAsset, type TestMember } from "./support/factories";
import { simulatedHistoryCsv } from "./support/history";

const DAY = 86_400_000;
// The scenario of tests/integration/drift.test.ts: seed 2026, 2 % stiffness loss on day 550.
const ONSET_DAY = 550;
const sim = simulateDriftHistory({ seed: 2026, days: ONSET_DAY + 40, onsetDay: ONSET_DAY, stiffnessLoss: 0.02 });
const t0 = sim.history.timesMs[0];
const tEnd = sim.history.timesMs[sim.history.timesMs.length - 1];
const period = { from: new Date(tEnd - 30 * DAY), to: new Date(tEnd + 1) };
const nowMs = tEnd + DAY;

const historyCsv = () => simulatedHistoryCsv(sim.history, () => "0.012");

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let secondOwner: TestMember;
let asset: Asset;
let worker: Worker;
let connection: ReturnType<typeof createRedisConnection>;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "mw-reports-"));

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  secondOwner = await makeMember(team.org, "owner");
  connection = createRedisConnection();
  worker = createMailWorker(connection);
  asset = await createAsset(team.engineer.actor, validAsset());
  await importModalHistory(team.engineer.actor, asset.id, historyCsv());
  await fitAndActivateBaseline(team.engineer.actor, asset.id, { from: new Date(t0), to: new Date(t0 + 366 * DAY) });
  const drift = await recomputeDrift(asset.id, { nowMs });
  if (drift.raisedAlertIds.length !== 1) throw new Error(`scenario should raise one alert (got ${drift.raisedAlertIds.length})`);
});
afterAll(async () => {
  await worker.close();
  await connection.quit();
  await closeQueues();
  closeMailTransport();
  await closeDb();
  fs.rmSync(tmp, { recursive: true, force: true });
});

/** Text of a PDF by poppler-utils' pdftotext (layout off, one space between words). */
function pdfText(pdf: Buffer): string {
  const file = path.join(tmp, `r-${Date.now()}.pdf`);
  fs.writeFileSync(file, pdf);
  return execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}

/** Image rows of `pdfimages -list` (two header lines, then one line per image or soft mask). */
function pdfImages(pdf: Buffer): string[][] {
  const file = path.join(tmp, `i-${Date.now()}.pdf`);
  fs.writeFileSync(file, pdf);
  const out = execFileSync("pdfimages", ["-list", file], { encoding: "utf8" });
  return out.trim().split("\n").slice(2).map((l) => l.trim().split(/\s+/));
}

const params = () => ({ params: Promise.resolve({ assetId: asset.id }) });
const get = (url: string, token?: string) =>
  new Request(`http://127.0.0.1/api/v1/assets/${asset.id}${url}`, { headers: token ? { authorization: `Bearer ${token}` } : {} });

describe("asset report PDF", () => {
  it("holds the owners' summary, the open alert, the caution and one trend image per chart", async () => {
    const r = await renderAssetReport(team.owner.actor, asset.id, period, { nowMs });
    expect(r.report.asset.condition).toBe("alert");
    const text = pdfText(r.pdf);
    expect(text).toContain("Summary for the owner");
    expect(text).toContain("What was found");
    expect(text).toMatch(/Alert raised on \d{4}-\d{2}-\d{2} .*open, not yet acknowledged/);
    expect(text).toContain("Engineering annex");
    // The caution of PRODUCT.md, word for word (pdftotext re-wraps lines: compare with single spaces).
    expect(text).toContain(REPORT_CAUTION.replace(/\s+/g, " "));
    const images = pdfImages(r.pdf).filter((cols) => cols[2] === "image");
    expect(images.length).toBeGreaterThanOrEqual(1);
    expect(images.length).toBe(r.charts.length);
    // Each embedded image has the chart's pixel size (pdfimages columns: width, height).
    for (const cols of images) expect([Number(cols[3]), Number(cols[4])]).toEqual([r.charts[0].width, r.charts[0].height]);
    // The simulation has 3 modes with data in the period: a frequency and a residual chart each.
    expect(r.charts).toHaveLength(2 * sim.history.modes.length);
  });

  it("serves the PDF to an owner, 401 without a token, 404 to another organisation, 422 to a bad period", async () => {
    const q = `/report?from=${period.from.toISOString()}&to=${period.to.toISOString()}`;
    const ok = await reportRoute.GET(get(q, await tokenFor(team.owner)), params());
    expect(ok.status).toBe(200);
    expect(ok.headers.get("content-type")).toBe("application/pdf");
    expect(ok.headers.get("content-disposition")).toMatch(/^attachment; filename=".+\.pdf"$/);
    const bytes = Buffer.from(await ok.arrayBuffer());
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect((await reportRoute.GET(get(q), params())).status).toBe(401);
    expect((await reportRoute.GET(get(q, await tokenFor(foreign.engineer)), params())).status).toBe(404);
    const bad = await reportRoute.GET(get("/report?from=yesterday", await tokenFor(team.owner)), params());
    expect(bad.status).toBe(422);
    const reversed = await reportRoute.GET(get(`/report?from=${period.to.toISOString()}&to=${period.from.toISOString()}`, await tokenFor(team.owner)), params());
    expect(reversed.status).toBe(422);
  });
});

describe("modal history export", () => {
  it("writes the dictionary's columns and one row per identified frequency of the range", async () => {
    const token = await tokenFor(team.inspector);
    const res = await csvRoute.GET(get(`/export/modal-history.csv?from=${period.from.toISOString()}&to=${period.to.toISOString()}`, token), params());
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    const lines = (await res.text()).trimEnd().split("\r\n");
    expect(lines[0].split(",")).toEqual(MODAL_HISTORY_DICTIONARY.map((d) => d.column));
    // Rows expected from the simulation itself: accepted rows inside the period × modes (all identified).
    const h = sim.history;
    let expected = 0;
    for (let i = 0; i < h.timesMs.length; i++) {
      if (h.timesMs[i] >= period.from.getTime() && h.timesMs[i] < period.to.getTime() && (!h.qualityPassed || h.qualityPassed[i])) expected += h.modes.length;
    }
    expect(lines.length - 1).toBe(expected);
    const first = lines[1].split(",");
    expect(Number(first[4])).toBeCloseTo(0.012, 12); // damping ratio as imported, a fraction
    const residual = Number(first[3]) - Number(first[6]);
    expect(Number(first[7])).toBeCloseTo(residual, 9); // residual = frequency − predicted (dictionary)
    expect((await csvRoute.GET(get("/export/modal-history.csv", await tokenFor(foreign.owner)), params())).status).toBe(404);
  });

  it("describes every column in the data dictionary (Markdown and CSV)", async () => {
    const token = await tokenFor(team.owner);
    const md = await dictRoute.GET(get("/export/data-dictionary", token), params());
    expect(md.headers.get("content-type")).toMatch(/^text\/markdown/);
    const text = await md.text();
    for (const d of MODAL_HISTORY_DICTIONARY) expect(text).toContain(`| ${d.column} |`);
    const csv = await dictRoute.GET(get("/export/data-dictionary?format=csv", token), params());
    expect((await csv.text()).trimEnd().split("\r\n")).toHaveLength(MODAL_HISTORY_DICTIONARY.length + 1);
    expect((await dictRoute.GET(get("/export/data-dictionary?format=xml", token), params())).status).toBe(422);
    expect((await dictRoute.GET(get("/export/data-dictionary", await tokenFor(foreign.owner)), params())).status).toBe(404);
  });
});

describe("monthly reports", () => {
  const month = new Date(tEnd).toISOString().slice(0, 7);
  const isMonthly = (to: string) => (m: { subject: string; to: string[] }) => m.subject.startsWith(`Monthly report ${month}`) && m.to.includes(to);

  it("sends exactly one e-mail per owner of the organisation, to nobody else, and none again on a second run", async () => {
    await clearMails();
    const out = await sendMonthlyReports({ month, nowMs, organisationIds: [team.org.id] });
    expect(out).toMatchObject({ month, assets: 1, mails: 2, failures: [] });
    const owners = [team.owner.email, secondOwner.email].map((e) => e.toLowerCase());
    for (const o of owners) await waitForMail(isMonthly(o));
    // A repeated run (a retried job) queues the same keyed jobs: nothing new is sent.
    await sendMonthlyReports({ month, nowMs, organisationIds: [team.org.id] });
    await new Promise((r) => setTimeout(r, 1500));
    const monthly = (await caughtMails()).filter((m) => m.subject.startsWith("Monthly report"));
    expect(monthly.map((m) => m.to).flat().sort()).toEqual([...owners].sort());
    for (const m of monthly) {
      expect(m.text).toContain(REPORT_CAUTION);
      expect(m.text).toContain(`/assets/${asset.id}`);
    }
  });

  // The mail job schema must carry attachments for the PDF to reach the message (lib/jobs/queues.ts, lead).
  it("attaches the PDF report to each owner's e-mail", async () => {
    // The month before: its mail jobs are not keyed yet, so they are sent.
    const d = new Date(tEnd);
    const before = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
    await clearMails();
    await sendMonthlyReports({ month: before, nowMs, organisationIds: [team.org.id] });
    const m = await waitForMail((x) => x.subject.startsWith(`Monthly report ${before}`) && x.to.includes(team.owner.email.toLowerCase()));
    expect(m.attachments).toHaveLength(1);
    expect(m.attachments[0]).toMatchObject({ contentType: "application/pdf" });
    expect(m.attachments[0].filename).toMatch(/\.pdf$/);
    expect(m.attachments[0].size).toBeGreaterThan(1000);
  });
});

describe("monthly report schedule", () => {
  it("keeps one job scheduler firing at 06:00 UTC on the 1st, however often it is upserted", async () => {
    const queue = new Queue(REPORTS_QUEUE, { connection });
    try {
      await scheduleMonthlyReports(queue);
      await scheduleMonthlyReports(queue);
      const schedulers = await queue.getJobSchedulers();
      expect(schedulers).toHaveLength(1);
      expect(schedulers[0]).toMatchObject({ pattern: MONTHLY_CRON, tz: "UTC" });
      // The next run is the coming 1st of a month at 06:00 UTC (cron "0 6 1 * *").
      const next = new Date(Number(schedulers[0].next));
      expect([next.getUTCDate(), next.getUTCHours(), next.getUTCMinutes()]).toEqual([1, 6, 0]);
      expect(next.getTime()).toBeGreaterThan(Date.now());
      expect(next.getTime() - Date.now()).toBeLessThanOrEqual(31 * DAY);
    } finally {
      await queue.obliterate({ force: true });
      await queue.close();
    }
  });
});
