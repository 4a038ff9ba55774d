/**
 * Asset › Analysis in the browser (issue 4): an engineer changes the band of interest and
 * sees the settings version go up by one (after a field error shown under its input), adds a
 * tracked mode from a design frequency, and reprocesses a date range holding a freshly
 * uploaded record, which the real worker then analyses again with the new version; an owner
 * sees the same page without any control. The page is reached by URL.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { demoGatewayKey } from "@/db/seeds/larkspur/seed-demo";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";
import { uploadSimulatedRecord, waitForRecord } from "./helpers/records";

// Fernbrook: no other browser test uploads to it, so the fresh record below is the only one
// of the last week with raw samples (Millrace takes the Records and Design tests' uploads).
const ASSET = DEMO_ASSETS.find((a) => a.gateway.slug === "fernbrook");
if (!ASSET) throw new Error("the demo seed has no Fernbrook Timber Footbridge");
const SPAN = ASSET.mainDimensionM;
const FS = 50;
const key = demoGatewayKey(ASSET.gateway.slug);
const analysisUrl = () => `${appUrl()}/assets/${ASSET.id}/analysis`;

// Two invented bending modes, sin(nπx/L) on the z channels [pub: Clough & Penzien, simply
// supported beam shapes]; nothing near the design mode added below.
const MODES = [1, 2].map((n) => ({
  frequencyHz: 2.2 * n * n, dampingRatio: 0.01,
  shape: (c: { x: number; direction: string }) => (c.direction === "z" ? Math.sin((n * Math.PI * c.x) / SPAN) : 0.05),
}));
const uploadRecord = () => uploadSimulatedRecord(key, ASSET, {
  modes: MODES, sampleRateHz: FS, durationS: 120, temperatureC: 9, idPrefix: "e2e-analysis", agoMin: 15,
});

describe("Analysis screen", () => {
  let users: Record<string, { email: string; password: string }>;
  let recordId: string;
  let designLabel: string;

  beforeAll(async () => {
    recordId = await uploadRecord();
    await waitForRecord(key, recordId, (r) => r.status === "analysed");
    const b = await openBrowser();
    try {
      users = await readDemoSignIns(b.page, appUrl());
    } finally {
      await b.close();
    }
  });

  describe("an engineer", () => {
    let b: BrowserSession;
    let version: number;
    beforeAll(async () => {
      b = await openBrowser();
      await signIn(b.page, appUrl(), users.engineer.email, users.engineer.password);
      await b.page.waitForURL(`${appUrl()}/`);
    });
    afterAll(async () => {
      await b?.close();
    });

    it("changes the band of interest and sees the settings version go up by one", async () => {
      const { page } = b;
      await page.goto(analysisUrl());
      const badge = page.getByTestId("settings-version");
      version = Number(await badge.getAttribute("data-version"));
      expect(version).toBeGreaterThanOrEqual(1);
      const form = page.getByTestId("settings-form");
      await form.getByLabel("Band low (Hz)").fill("0.8");
      await form.getByLabel("Band high (Hz)").fill("18");
      // A segment length that is no power of two is refused under its own field, nothing saved.
      await form.getByLabel("Segment length (samples)").fill("1000");
      await form.getByRole("button", { name: "Save as new version" }).click();
      await form.locator("#f-segmentLength-error").waitFor();
      expect(await form.locator("#f-segmentLength-error").innerText()).toMatch(/power of two/i);
      expect(Number(await badge.getAttribute("data-version"))).toBe(version);
      await form.getByLabel("Segment length (samples)").fill("auto");
      await form.getByRole("button", { name: "Save as new version" }).click();
      await page.waitForFunction((v) => document.querySelector("[data-testid=settings-version]")?.getAttribute("data-version") === String(v), version + 1);
      await page.getByText(`Saved as version ${version + 1}`).waitFor();
      // The version before is listed among the earlier ones.
      await page.getByTestId("settings-history").locator("summary").click();
      await page.locator(`[data-settings-version="${version}"]`).waitFor();
      // After a reload the form shows the saved band.
      await page.reload();
      expect(await page.getByTestId("settings-form").getByLabel("Band low (Hz)").inputValue()).toBe("0.8");
      expect(await page.getByTestId("settings-form").getByLabel("Band high (Hz)").inputValue()).toBe("18");
    });

    it("adds a tracked mode from a design frequency with the default ±5 % band", async () => {
      const { page } = b;
      const label = `design sway ${Date.now() % 100000}`;
      designLabel = label;
      await page.getByRole("button", { name: "Add from a design frequency" }).click();
      const form = page.getByTestId("add-mode-form");
      await form.getByLabel("Label").fill(label);
      await form.getByRole("button", { name: "Add tracked mode" }).click();
      await form.locator("#add-nominalFrequencyHz-error").waitFor();
      await form.getByLabel("Frequency (Hz)").fill("5.3");
      await form.getByRole("button", { name: "Add tracked mode" }).click();
      const row = page.locator(`[data-tracked-mode="${label}"]`);
      await row.waitFor();
      expect(await row.innerText()).toContain("Design / FE entry");
      // Default band ±5 % of the nominal frequency [practice: tracking/schemas DEFAULT_BAND_FRACTION]: 5.035–5.565 Hz.
      expect(await row.locator("[data-band]").innerText()).toBe("5.035–5.565 Hz");
      // Not sought by any record analysed before it existed.
      expect(await row.locator("[data-rate]").getAttribute("data-sought")).toBe("0");
      await screenshot(page, "analysis-engineer");
    });

    it("checks a date range, queues it with the new version, and the record is analysed again with it", async () => {
      const { page } = b;
      const panel = page.getByTestId("reprocess-range");
      await panel.getByRole("button", { name: "Check range" }).click();
      const plan = panel.getByTestId("reprocess-plan");
      await plan.waitFor();
      const toQueue = Number(await plan.getAttribute("data-to-queue"));
      expect(Number(await plan.getAttribute("data-settings-version"))).toBe(version + 1);
      // The fresh upload is the only record of the last week with raw samples (demo history has none).
      expect(toQueue).toBe(1);
      await plan.getByRole("button", { name: "Queue 1 record" }).click();
      const queued = panel.getByTestId("reprocess-queued");
      await queued.waitFor();
      expect(Number(await queued.getAttribute("data-queued"))).toBe(toQueue);
      expect(await panel.innerText()).toMatch(/Earlier results are kept/);
      await screenshot(page, "analysis-engineer-reprocessed");
      const after = await waitForRecord(key, recordId, (r) => r.status === "analysed" && r.analysedSettingsVersion === version + 1);
      expect(after.analysedSettingsVersion).toBe(version + 1);
    });

    it("edits the design mode's band, then deactivates it", async () => {
      const { page } = b;
      await page.reload();
      const row = page.locator(`[data-tracked-mode="${designLabel}"]`);
      await row.getByRole("button", { name: "Edit" }).click();
      const form = page.locator(`[data-edit-row="${designLabel}"]`).getByTestId("edit-mode-form");
      // A band that misses the nominal frequency is refused under the band's field.
      await form.getByLabel("Band low (Hz)").fill("5.4");
      await form.getByRole("button", { name: "Save" }).click();
      await form.locator("[id$=\"-bandLowHz-error\"]").waitFor();
      await screenshot(page, "analysis-engineer-edit");
      await form.getByLabel("Band low (Hz)").fill("5.1");
      await form.getByLabel("Band high (Hz)").fill("5.5");
      await form.getByRole("button", { name: "Save" }).click();
      await page.waitForFunction((l) => document.querySelector(`[data-tracked-mode="${l}"] [data-band]`)?.textContent === "5.100–5.500 Hz", designLabel);
      await row.getByRole("button", { name: "Deactivate" }).click();
      await page.waitForFunction((l) => document.querySelector(`[data-tracked-mode="${l}"]`)?.getAttribute("data-active") === "false", designLabel);
      expect(await row.getByRole("button", { name: "Reactivate" }).count()).toBe(1);
    });
  });

  describe("an owner", () => {
    let b: BrowserSession;
    beforeAll(async () => {
      b = await openBrowser();
      await signIn(b.page, appUrl(), users.owner.email, users.owner.password);
      await b.page.waitForURL(`${appUrl()}/`);
    });
    afterAll(async () => {
      await b?.close();
    });

    it("sees settings, tracked modes and rates without any control", async () => {
      const { page } = b;
      await page.goto(analysisUrl());
      await page.getByTestId("settings-summary").waitFor();
      expect(await page.getByTestId("settings-summary").innerText()).toContain("0.8–18 Hz");
      expect(await page.getByTestId("settings-form").count()).toBe(0);
      expect(await page.locator("[data-tracked-mode]").count()).toBeGreaterThan(0);
      expect(await page.getByTestId("rate-summary").count()).toBe(1);
      // The reprocessed record sought the design mode and, simulated with modes at 2.2 and 8.8 Hz
      // only, did not find it in its band; deactivating kept that history.
      const design = page.locator(`[data-tracked-mode="${designLabel}"]`);
      expect(await design.getAttribute("data-active")).toBe("false");
      expect(await design.locator("[data-rate]").getAttribute("data-sought")).toBe("1");
      expect(await design.locator("[data-rate]").getAttribute("data-identified")).toBe("0");
      expect(await page.getByTestId("reprocess-range").count()).toBe(0);
      expect(await page.getByTestId("add-mode").count()).toBe(0);
      expect(await page.getByRole("button", { name: /Edit|Deactivate|Reactivate|Save|Queue|Check range/ }).count()).toBe(0);
      await screenshot(page, "analysis-owner");
    });
  });
});
