/**
 * Owner's tour of the demo (issue 6 §1, §5): the Portfolio's needs-attention list names Heron
 * Reach's open alert and Carrow Hill's flat-lined sensor (PRODUCT.md demo scenario), the
 * condition counts filter the table and the map, and Heron Reach's Overview gives the
 * condition's reason, the caution, the mode table and the channel timeline.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { screenshot, signIn } from "./flows";

const OWNER = { email: "owner@larkspur.example", password: "larkspur-owner-2026" };

describe("Owner: needs attention and the Asset Overview", () => {
  let b: BrowserSession;

  beforeAll(async () => {
    b = await openBrowser({ viewport: { width: 1440, height: 1000 } });
    await signIn(b.page, appUrl(), OWNER.email, OWNER.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("lists Heron Reach's open alert (linking to the alert) and Carrow Hill's flat-lined sensor under Needs attention", async () => {
    const { page } = b;
    const list = page.getByTestId("needs-attention");
    await list.waitFor();
    const heron = list.locator("li[data-attention-kind=alert]", { hasText: "Heron Reach" });
    expect(await heron.count()).toBe(1);
    expect(await heron.locator("a").getAttribute("href")).toMatch(/^\/alerts\/[0-9a-f-]{36}$/);
    // demo-modal.ts: Carrow Hill's A4 is flat for its last 24 days.
    const carrow = list.locator("li[data-attention-kind=data]", { hasText: "Carrow Hill" });
    expect(await carrow.count()).toBeGreaterThanOrEqual(1);
    expect(await carrow.first().innerText()).toContain("Sensor A4 flat-lined");
    await page.locator("[data-testid=portfolio-map][data-rendered-assets]:not([data-rendered-assets=''])").waitFor();
    await screenshot(page, "portfolio-owner-attention");
  });

  it("filters the table and the map to one condition when its count is pressed", async () => {
    const { page } = b;
    const total = await page.locator("[data-asset-row]").count();
    await page.locator("[data-condition-count=alert]").click();
    await page.waitForURL(/[?&]condition=alert/);
    const rows = page.locator("[data-asset-row]");
    expect(await rows.count()).toBe(1);
    expect(await rows.first().innerText()).toContain("Heron Reach");
    expect(await page.getByTestId("portfolio-map").getAttribute("data-asset-count")).toBe("1");
    await page.getByRole("button", { name: "All assets" }).click();
    expect(await page.locator("[data-asset-row]").count()).toBe(total);
  });

  it("opens Heron Reach: the reason in plain words, the caution, the mode table and the channel timeline", async () => {
    const { page } = b;
    await page.locator("[data-asset-row]", { hasText: "Heron Reach" }).getByRole("link").click();
    await page.waitForURL(/\/assets\/[0-9a-f-]{36}$/);
    await page.getByTestId("asset-overview").waitFor();
    expect(await page.getByTestId("overview-condition").getAttribute("data-condition")).toBe("alert");
    // demo-modal.ts: a 2 % stiffness loss lowers every frequency by 1 − √0.98 ≈ 1.0 %.
    const reason = await page.getByTestId("condition-reason").innerText();
    expect(reason).toMatch(/Mode \d \([^)]+\) is \d+\.\d % below its temperature-compensated baseline for \d+ days/);
    expect(reason).toMatch(/an alert is open/);
    const caution = await page.getByTestId("overview-caution").innerText();
    expect(caution).toContain("not an engineering assessment");
    expect(caution).toContain("licensed structural engineer");
    // Four tracked modes on the demo footbridges (demo-modal.ts), at least one beyond its limit.
    expect(await page.locator("[data-mode-row]").count()).toBeGreaterThanOrEqual(3);
    expect(await page.locator("[data-mode-row][data-beyond=true]").count()).toBeGreaterThanOrEqual(1);
    // Identification rate over 30 days (H2's getIdentificationRates): "N %" over "identified of sought".
    expect(await page.locator("[data-mode-row='1']").innerText()).toMatch(/\d+ %\s+\d+ of \d+/);
    // Eight channels (data.ts), thirty days each.
    expect(await page.locator("[data-testid=channel-timeline] [data-channel]").count()).toBe(8);
    expect(await page.locator("[data-testid=channel-timeline] [data-channel=A1] [data-day]").count()).toBe(30);
    expect(await page.locator("[data-testid=overview-alerts] a[href^='/alerts/']").count()).toBe(1);
    // The serviceability indication (H5's panel) sits in its slot: a footbridge's.
    expect(await page.locator("[data-testid=serviceability-slot] [data-testid=serviceability-panel]").getAttribute("data-family")).toBe("footbridge");
    await page.locator("[data-testid=portfolio-map][data-rendered-assets='1']").waitFor();
    await screenshot(page, "overview-heron-reach");
  });

  it("shows Carrow Hill's A4 as excluded in every record on its recent days", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/`);
    await page.locator("[data-asset-row]", { hasText: "Carrow Hill" }).getByRole("link").click();
    await page.getByTestId("asset-overview").waitFor();
    const a4 = page.locator("[data-testid=channel-timeline] [data-channel=A4] [data-day]");
    const states = await a4.evaluateAll((cells) => cells.map((c) => c.getAttribute("data-state")));
    const withData = states.filter((s) => s !== "no_data");
    expect(withData.length).toBeGreaterThan(0);
    expect(withData[withData.length - 1]).toBe("dead");
    expect(await page.getByTestId("channel-issues").innerText()).toContain("Sensor A4");
    await screenshot(page, "overview-carrow-hill");
  });
});
