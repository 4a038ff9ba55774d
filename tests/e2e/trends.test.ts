/**
 * Trends, Baselines and History import in the browser (issue 5 screens): an engineer opens
 * Heron Reach's Trends (the demo asset in alert), sees the charts with their legends and the
 * smallest detectable shift per mode, changes the range and downloads a chart's CSV; opens
 * the Baselines section; imports a small history file with a bad row (the line is named and
 * nothing can be imported), then a good one (preview, confirm, and a second import changes
 * nothing). Pages are reached by URL (the section tabs are wired separately).
 */
import fs from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";

const HERON = DEMO_ASSETS.find((a) => a.gateway.slug === "heron-reach");
if (!HERON) throw new Error("the demo seed has no Heron Reach");

const HEADER = "timestamp,mode,frequencyHz,dampingRatio,temperatureC";

describe("Trends screens (engineer)", () => {
  let b: BrowserSession;

  beforeAll(async () => {
    b = await openBrowser({ viewport: { width: 1400, height: 1000 } });
    const users = await readDemoSignIns(b.page, appUrl());
    await signIn(b.page, appUrl(), users.engineer.email, users.engineer.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("shows Heron Reach's charts with legends, alert marks and the smallest detectable shift", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/assets/${HERON.id}/trends`);
    await page.getByTestId("chart-t2").locator("canvas").waitFor();
    const rows = page.getByTestId("minimal-shift").locator("tr");
    const modes = await rows.count();
    expect(modes).toBeGreaterThanOrEqual(2);
    // Per mode four charts, plus the asset's T² chart, each a canvas.
    expect(await page.locator("figure canvas").count()).toBe(4 * modes + 1);
    for (const id of ["chart-frequency", "chart-temperature", "chart-ewma", "chart-damping"]) {
      expect(await page.getByTestId(id).count()).toBe(modes);
    }
    const legends = await page.getByTestId("chart-legend").allInnerTexts();
    const all = legends.join("\n");
    for (const text of ["Baseline prediction", "Prediction band (±3 s", "Out of envelope, no decision", "EWMA (λ = 0.1)", "Control limits", "Alert raised", "Advisory limits", "UCL ="]) {
      expect(all).toContain(text);
    }
    // Heron Reach's stiffness loss: the demo opens in alert with an alert raised.
    await expect(page.getByText("Alert", { exact: true }).first().isVisible()).resolves.toBe(true);
    expect(await page.getByText(/Raised \d{2} \w{3} \d{4}/).count()).toBeGreaterThan(0);
    const shift = await rows.first().locator("td").nth(2).innerText();
    expect(shift).toMatch(/^\d+\.\d{2} mHz \(\d+\.\d{2} %\)$/);
    expect(await page.getByText(/Advisory only/).count()).toBe(modes);
    await screenshot(page, "trends-heron-reach");
  });

  it("changes the range and downloads a chart's CSV", async () => {
    const { page } = b;
    await page.getByRole("navigation", { name: "Time range" }).getByRole("link", { name: "Last 90 d" }).click();
    await page.waitForURL(/range=90d/);
    await page.getByTestId("chart-ewma").first().locator("canvas").waitFor();
    expect(await page.getByRole("link", { name: "Last 90 d" }).getAttribute("aria-current")).toBe("page");
    await screenshot(page, "trends-heron-reach-90d");

    const link = page.getByTestId("chart-ewma").first().getByTestId("csv-link");
    expect(await link.getAttribute("href")).toMatch(/trends\.csv\?from=[^&]+&chart=ewma$/);
    const [download] = await Promise.all([page.waitForEvent("download"), link.click()]);
    const file = await download.path();
    const lines = fs.readFileSync(file, "utf8").trimEnd().split("\r\n");
    expect(lines[0]).toBe("day,mode,residualHz,residualLclHz,residualUclHz,ewmaHz,ewmaLclHz,ewmaUclHz,beyond,outOfEnvelope");
    expect(lines.length).toBeGreaterThan(60);
    const firstDay = Date.parse(lines[1].split(",")[0]);
    expect(Date.now() - firstDay).toBeLessThanOrEqual(91 * 86_400_000);
  });

  it("lists the baseline versions with the active one's models", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/assets/${HERON.id}/baselines`);
    const versions = page.getByTestId("baseline-versions").locator("tr");
    expect(await versions.count()).toBeGreaterThanOrEqual(1);
    expect(await versions.first().innerText()).toMatch(/active/);
    expect(await page.getByRole("button", { name: "Fit and activate" }).count()).toBe(1);
    await screenshot(page, "baselines-heron-reach");
  });

  it("imports a history: a bad row is named and blocks the import; a good file is previewed, confirmed, and not imported twice", async () => {
    const { page } = b;
    const created = await page.evaluate(async () => {
      const res = await fetch("/api/v1/assets", {
        method: "POST", headers: { "content-type": "application/json" },
        body: JSON.stringify({ name: `E2E history ${Date.now()}`, kind: "footbridge", latitude: 39.1, longitude: -104.0, expectedIntervalMin: 60 }),
      });
      return { status: res.status, body: (await res.json()) as { asset?: { id: string } } };
    });
    expect(created.status).toBe(201);
    const assetId = created.body.asset?.id ?? "";
    await page.goto(`${appUrl()}/assets/${assetId}/history`);
    const input = page.getByLabel("History CSV");

    const bad = [HEADER, "2025-01-01T00:00:00Z,Vertical 1,2.101,0.012,3.5", "2025-01-01T06:00:00Z,Vertical 1,-2.1,0.012,4.0", "2025-01-01T12:00:00Z,Vertical 1,2.099,,5.0"].join("\n");
    await input.setInputFiles({ name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Preview" }).click();
    const errors = page.getByTestId("preview-errors");
    await errors.waitFor();
    // Line 3 of the file holds the negative frequency (line 1 is the header).
    expect(await errors.innerText()).toMatch(/Line 3\s+.*frequencyHz/);
    expect(await page.getByRole("button", { name: /^Import/ }).count()).toBe(0);
    await screenshot(page, "history-import-bad-row");

    const good = [
      HEADER,
      "2025-01-01T00:00:00Z,Vertical 1,2.101,0.012,3.5",
      "2025-01-01T00:00:00Z,Lateral 1,3.402,,3.5",
      "2025-01-01T06:00:00Z,Vertical 1,2.097,0.011,4.0",
      "2025-01-01T06:00:00Z,Lateral 1,3.398,0.020,5.0",
    ].join("\n");
    await input.setInputFiles({ name: "good.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
    await page.getByRole("button", { name: "Preview" }).click();
    await page.getByTestId("preview-modes").getByText("Lateral 1: 2 rows · new tracked mode").waitFor();
    expect(await page.getByTestId("preview-rows").innerText()).toBe("4");
    expect(await page.getByTestId("preview-error-count").innerText()).toBe("0");
    const modes = await page.getByTestId("preview-modes").innerText();
    expect(modes).toContain("Vertical 1: 2 rows · new tracked mode");
    expect(modes).toContain("Lateral 1: 2 rows · new tracked mode");
    expect(await page.getByTestId("preview-first-rows").locator("tr").count()).toBe(4);
    await screenshot(page, "history-import-preview");
    await page.getByRole("button", { name: "Import 4 rows" }).click();
    await page.getByText("Imported 4 of 4 rows").waitFor();

    // The same file again: the preview says so and a confirm writes nothing.
    await page.getByRole("button", { name: "Preview" }).click();
    await page.getByText("This file was imported before").waitFor();
    await page.getByRole("button", { name: "Import 4 rows" }).click();
    await page.getByText(/Imported 0 of 4 rows/).waitFor();
  });
});
