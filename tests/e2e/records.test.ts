/**
 * Records screens in the browser (issue 4 check "Browser"): an engineer opens an analysed
 * record, sees the singular value spectrum with its picked peaks, starts tracking a mode and
 * reprocesses the record, after which the mode is assigned to the new tracked mode; an owner
 * sees the same page without any control. The record is simulated here, uploaded through the
 * gateway API with the demo gateway key and analysed by the real worker of the e2e stage.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { demoGatewayKey } from "@/db/seeds/larkspur/seed-demo";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";
import { uploadSimulatedRecord, waitForRecord } from "./helpers/records";

const ASSET = DEMO_ASSETS.find((a) => a.gateway.slug === "millrace");
if (!ASSET) throw new Error("the demo seed has no Millrace Footbridge");
const SPAN = ASSET.mainDimensionM;
const FS = 50;
const DURATION_S = 300;
// Invented modal model of the 42 m span: vertical bending sin(nπx/L) on the z channels (simply
// supported beam shapes [pub: Clough & Penzien, distributed-parameter systems]), a lateral mode
// on the y channel. The record is made from these; the test looks for them in the analysis.
const MODES = [
  { frequencyHz: 2.2, dampingRatio: 0.01, shape: (c: { x: number; direction: string }) => (c.direction === "z" ? Math.sin((Math.PI * c.x) / SPAN) : 0.05) },
  { frequencyHz: 3.6, dampingRatio: 0.012, shape: (c: { x: number; direction: string }) => (c.direction === "y" ? 1 : 0.03) },
  { frequencyHz: 7.9, dampingRatio: 0.01, shape: (c: { x: number; direction: string }) => (c.direction === "z" ? Math.sin((2 * Math.PI * c.x) / SPAN) : 0.02) },
];

/** Frequencies shown in the modal table, in Hz. */
async function tableFrequencies(b: BrowserSession): Promise<{ index: number; hz: number }[]> {
  const rows = b.page.locator("[data-mode-row]");
  const n = await rows.count();
  const out: { index: number; hz: number }[] = [];
  for (let i = 0; i < n; i++) {
    const cell = await rows.nth(i).locator("td").nth(1).innerText();
    out.push({ index: Number(await rows.nth(i).getAttribute("data-mode-row")), hz: parseFloat(cell) });
  }
  return out;
}

describe("Records screens", () => {
  let users: Record<string, { email: string; password: string }>;
  let recordId: string;
  const key = demoGatewayKey(ASSET.gateway.slug);
  const recordUrl = () => `${appUrl()}/assets/${ASSET.id}/records/${recordId}`;

  beforeAll(async () => {
    recordId = await uploadSimulatedRecord(key, ASSET, {
      modes: MODES, sampleRateHz: FS, durationS: DURATION_S, temperatureC: 11.5, idPrefix: "e2e", agoMin: 10,
    });
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
    beforeAll(async () => {
      b = await openBrowser();
      await signIn(b.page, appUrl(), users.engineer.email, users.engineer.password);
      await b.page.waitForURL(`${appUrl()}/`);
    });
    afterAll(async () => {
      await b?.close();
    });

    it("finds the record in the asset's Records list and opens it", async () => {
      const { page } = b;
      await page.goto(`${appUrl()}/assets/${ASSET.id}`);
      await page.getByRole("navigation", { name: "Asset sections" }).getByRole("link", { name: "Records" }).click();
      await page.waitForURL(/\/records$/);
      const row = page.locator(`[data-record-row="${recordId}"]`);
      await row.waitFor();
      expect(await row.getAttribute("data-status")).toBe("analysed");
      expect(await row.locator("[data-verdict]").getAttribute("data-verdict")).toBe("accept");
      await screenshot(page, "records-list-engineer");
      await row.getByRole("link").first().click();
      await page.waitForURL(recordUrl());
    });

    it("sees the singular value spectrum with a picked peak at each simulated mode", async () => {
      const { page } = b;
      const chart = page.getByTestId("spectrum-chart");
      await chart.locator("canvas").waitFor();
      const found = await tableFrequencies(b);
      expect(Number(await chart.getAttribute("data-peaks"))).toBe(found.length);
      // Each mode the record was simulated from is identified within 2 % of its input frequency
      // (300 s at ζ ≈ 1 %: random error ≈ √(ζ/(2πfT)) < 0.5 % [pub: Bendat & Piersol §8.5]).
      for (const m of MODES) expect(found.some((f) => Math.abs(f.hz / m.frequencyHz - 1) < 0.02)).toBe(true);
      const shape = page.getByTestId("mode-shape");
      expect(await shape.locator("svg").count()).toBe(2);
      // "Animate" moves the deformed line (elevation: the vertical mode is drawn there).
      const still = await shape.locator("[data-deformed]").last().getAttribute("d");
      await shape.getByRole("button", { name: "Animate" }).click();
      await page.waitForFunction((d) => [...document.querySelectorAll("[data-testid=mode-shape] [data-deformed]")].some((p) => p.getAttribute("d") !== d), still);
      await shape.getByRole("button", { name: "Stop" }).click();
      await screenshot(page, "record-engineer");
    });

    it("starts tracking a mode, reprocesses, and the mode is then assigned to it", async () => {
      const { page } = b;
      // The first simulated mode not yet tracked on the asset (on a fresh stack: the first bending mode).
      const candidates = (await tableFrequencies(b)).filter((f) => MODES.some((m) => Math.abs(f.hz / m.frequencyHz - 1) < 0.02));
      let pick: { index: number; hz: number } | undefined;
      for (const c of candidates) {
        if (await page.locator(`[data-mode-row="${c.index}"]`).getByRole("button", { name: "Track this mode" }).count()) {
          pick = c;
          break;
        }
      }
      expect(pick).toBeDefined();
      const row = page.locator(`[data-mode-row="${pick!.index}"]`);
      const label = `tracked in e2e ${Date.now()}`;
      await row.getByRole("button", { name: "Track this mode" }).click();
      const form = page.getByTestId("track-mode-form");
      await form.getByRole("button", { name: "Start tracking" }).click();
      await form.locator("#f-label-error").waitFor();
      expect(await form.locator("#f-label-error").innerText()).toMatch(/label is required/i);
      await form.getByLabel("Label").fill(label);
      await form.getByRole("button", { name: "Start tracking" }).click();
      await page.getByText(`Now tracking “${label}”`).waitFor();

      await page.getByTestId("record-controls").getByRole("button", { name: "Reprocess" }).click();
      // The action's answer is short-lived on screen: the page refreshes at once, hides the
      // controls while the record is queued or analysing, and shows them again once it is
      // analysed. Accept any of those signs that the reprocess was taken.
      await page.waitForFunction((wanted) => {
        const status = document.querySelector("[data-testid=record-page]")?.getAttribute("data-status");
        const queuedNote = document.querySelector("[data-testid=record-controls] [role=status]") !== null;
        const assigned = [...document.querySelectorAll("[data-mode-row] [data-tracked-label]")].some((e) => e.textContent?.includes(wanted));
        return status !== "analysed" || queuedNote || assigned;
      }, label, { timeout: 30_000 });
      expect(await page.getByTestId("record-controls").locator("[role=alert]").count()).toBe(0);
      // The page refreshes itself while the record is queued and analysed again.
      await page.waitForFunction((id) => {
        const el = document.querySelector("[data-testid=record-page]");
        return el?.getAttribute("data-status") === "analysed" && document.querySelector(`[data-mode-row] [data-tracked-label]`) !== null && id !== "";
      }, recordId, { timeout: 90_000 });
      const labels = await page.locator("[data-mode-row] [data-tracked-label]").allInnerTexts();
      expect(labels).toContain(label);
      const tracked = page.locator("[data-mode-row]", { has: page.locator("[data-tracked-label]", { hasText: label }) });
      const hz = parseFloat(await tracked.locator("td").nth(1).innerText());
      expect(Math.abs(hz / pick!.hz - 1)).toBeLessThan(0.02);
      expect(Number(await page.getByTestId("spectrum-chart").getAttribute("data-bands"))).toBeGreaterThanOrEqual(1);
      await screenshot(page, "record-engineer-tracked");
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

    it("sees the same record page without tracking, reprocessing or retry controls", async () => {
      const { page } = b;
      await page.goto(recordUrl());
      await page.getByTestId("spectrum-chart").locator("canvas").waitFor();
      expect(await page.locator("[data-mode-row]").count()).toBeGreaterThan(0);
      expect(await page.getByTestId("record-controls").count()).toBe(0);
      expect(await page.getByRole("button", { name: "Track this mode" }).count()).toBe(0);
      expect(await page.getByRole("button", { name: /Reprocess|Retry/ }).count()).toBe(0);
      await screenshot(page, "record-owner");
    });
  });
});
