/**
 * The asset report in the built app (issue 6 part 4), owner's view of the demo: Heron Reach's
 * report page shows the summary with its open alert, the caution and the trend images; the
 * "Download PDF" link serves a PDF (read back with poppler's pdftotext) through Next's server
 * bundle, and the modal-history CSV starts with its documented header.
 */
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { REPORT_CAUTION } from "@/lib/reports/caution";
import { MODAL_HISTORY_DICTIONARY } from "@/lib/reports/modal-history-csv";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { fetchAssetsInPage, screenshot, signIn } from "./flows";

const OWNER = { email: "owner@larkspur.example", password: "larkspur-owner-2026" };

describe("Owner: Heron Reach's report", () => {
  let b: BrowserSession;
  let assetId = "";
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "mw-e2e-reports-"));

  beforeAll(async () => {
    b = await openBrowser({ viewport: { width: 1280, height: 1000 } });
    await signIn(b.page, appUrl(), OWNER.email, OWNER.password);
    await b.page.waitForURL(`${appUrl()}/`);
    const heron = (await fetchAssetsInPage(b.page)).find((a) => a.name.startsWith("Heron Reach"));
    if (!heron) throw new Error("demo asset Heron Reach not found");
    assetId = heron.id;
  });
  afterAll(async () => {
    await b?.close();
    fs.rmSync(tmp, { recursive: true, force: true });
  });

  it("shows the summary with the open alert, the caution and the trend images", async () => {
    const { page } = b;
    await page.goto(`/assets/${assetId}/report`);
    await page.getByTestId("report").waitFor();
    expect(await page.getByTestId("report-done").innerText()).toMatch(/Alert raised on \d{4}-\d{2}-\d{2}.*(open|acknowledged|inspection scheduled)/);
    expect((await page.getByTestId("report-caution").first().innerText()).replace(/\s+/g, " ")).toContain(REPORT_CAUTION);
    const images = page.getByTestId("report-chart");
    expect(await images.count()).toBeGreaterThanOrEqual(1);
    // Each image decoded by the browser at the chart's pixel size (lib/reports/report-charts.ts: 1000 × 330).
    const sizes = await images.evaluateAll((els) => els.map((e) => [(e as HTMLImageElement).naturalWidth, (e as HTMLImageElement).naturalHeight]));
    for (const s of sizes) expect(s).toEqual([1000, 330]);
    await screenshot(page, "report-heron-reach");
  });

  it("downloads the PDF through the app and exports the modal history with its documented header", async () => {
    const { page } = b;
    const href = await page.getByTestId("report-download").getAttribute("href");
    expect(href).toMatch(new RegExp(`^/api/v1/assets/${assetId}/report\\?`));
    const res = await page.request.get(`${appUrl()}${href}`);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toBe("application/pdf");
    const file = path.join(tmp, "report.pdf");
    fs.writeFileSync(file, await res.body());
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("Heron Reach");
    expect(text).toContain("Summary for the owner");
    expect(text).toContain(REPORT_CAUTION);
    const csv = await page.request.get(`${appUrl()}/api/v1/assets/${assetId}/export/modal-history.csv`);
    expect(csv.status()).toBe(200);
    expect((await csv.text()).split("\r\n")[0]).toBe(MODAL_HISTORY_DICTIONARY.map((d) => d.column).join(","));
  });
});
