/**
 * Design comparison in the browser (issue 6 §4): an engineer enters design frequencies for
 * the demo Millrace Footbridge and sees, per design mode, the matched tracked mode and the
 * measured / design ratio; the serviceability page shows the caution and the footbridge
 * checks. The ratio on screen is checked against the median and design values on the same row.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";

const ASSET = DEMO_ASSETS.find((a) => a.name.startsWith("Millrace"));
if (!ASSET) throw new Error("the demo seed has no Millrace Footbridge");
const MAST = DEMO_ASSETS.find((a) => a.kind === "mast");

const hzOf = (text: string) => Number(/([0-9.]+) Hz/.exec(text)?.[1] ?? Number.NaN);

describe("An engineer on the design page", () => {
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

  it("enters design frequencies and sees measured / design ratios for the matched tracked modes", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/assets/${ASSET.id}/design`);
    await page.getByTestId("design-page").waitFor();
    const form = page.getByTestId("design-mode-form");

    // An empty frequency is refused under its field.
    await form.getByLabel("Label").fill("FE vertical 1");
    await form.getByRole("button", { name: "Add design mode" }).click();
    await form.locator("#f-frequencyHz-error").waitFor();
    expect(await form.locator("#f-frequencyHz-error").innerText()).toMatch(/required/i);

    await form.getByLabel("Design frequency (Hz)").fill("2.95");
    await form.getByLabel("Direction").selectOption("vertical");
    await form.getByLabel("Source").fill("Design calculation, 2011");
    await form.getByRole("button", { name: "Add design mode" }).click();
    await page.getByText("Added “FE vertical 1”").waitFor();

    const form2 = page.getByTestId("design-mode-form");
    await form2.getByLabel("Label").fill("FE vertical 2");
    await form2.getByLabel("Design frequency (Hz)").fill("12.6");
    await form2.getByRole("button", { name: "Add design mode" }).click();
    await page.getByText("Added “FE vertical 2”").waitFor();
    await page.locator("[data-testid=design-mode-row]", { hasText: "FE vertical 2" }).waitFor();

    for (const [label, design, tracked] of [["FE vertical 1", 2.95, "1st vertical bending"], ["FE vertical 2", 12.6, "2nd vertical bending"]] as const) {
      const row = page.locator("[data-testid=comparison-row]", { hasText: label });
      await row.waitFor();
      expect(await row.innerText()).toContain(tracked);
      const cells = row.locator("td");
      const median = hzOf(await cells.nth(3).innerText());
      const ratio = Number(await row.getByTestId("comparison-ratio").innerText());
      // The ratio shown is the row's measured median over its design frequency (3 decimals).
      expect(Math.abs(ratio - median / design)).toBeLessThan(6e-4);
      expect(ratio).toBeGreaterThan(0.8);
      expect(ratio).toBeLessThan(1.25);
    }
    // Tracked modes without a design mode are flagged.
    expect(await page.locator("[data-testid=comparison-row][data-flag=no_design_mode]").count()).toBeGreaterThan(0);
    await screenshot(page, "design-comparison");
  });

  it("sees the caution and the footbridge checks on the serviceability page", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/assets/${ASSET.id}/serviceability`);
    await page.getByTestId("serviceability-panel").waitFor();
    expect(await page.getByTestId("serviceability-caution").innerText()).toMatch(/not an engineering assessment[\s\S]*no code verification/i);
    expect(await page.getByTestId("serviceability-panel").getAttribute("data-family")).toBe("footbridge");
    expect(await page.getByTestId("serviceability-mode").count()).toBeGreaterThan(0);
    await screenshot(page, "serviceability-footbridge");
    if (MAST) {
      await page.goto(`${appUrl()}/assets/${MAST.id}/serviceability`);
      await page.getByTestId("serviceability-inputs").getByLabel("Section width b (m)").fill("0.8");
      await page.getByTestId("serviceability-inputs").getByRole("button", { name: "Save" }).click();
      await page.getByTestId("serviceability-inputs").getByText("Saved.").waitFor();
      await page.locator("[data-testid=vortex-mode]", { hasText: "m/s" }).first().waitFor();
      await screenshot(page, "serviceability-mast");
    }
  });
});
