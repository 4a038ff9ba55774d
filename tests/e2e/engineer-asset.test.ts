import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";

describe("An engineer", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
    const users = await readDemoSignIns(b.page, appUrl());
    await signIn(b.page, appUrl(), users.engineer.email, users.engineer.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("creates an asset (errors under each field first) and adds channels, with a duplicate code refused under its input", async () => {
    const { page } = b;
    const name = `Ashby Weir Footbridge ${Date.now()}`;
    await page.getByRole("link", { name: "New asset" }).click();
    await page.waitForURL(`${appUrl()}/assets/new`);
    const form = page.getByTestId("asset-form");

    // Nothing filled in: the name and both coordinates get their own messages.
    await form.getByLabel("Expected record interval (min)").fill("0");
    await form.getByRole("button", { name: "Create asset" }).click();
    await form.locator("#f-name-error").waitFor();
    expect(await form.locator("#f-name-error").innerText()).toMatch(/name is required/i);
    expect(await form.locator("#f-latitude-error").innerText()).toMatch(/latitude/i);
    expect(await form.locator("#f-longitude-error").innerText()).toMatch(/longitude/i);
    expect(await form.locator("#f-expectedIntervalMin-error").innerText()).toMatch(/at least 1 minute/i);
    await screenshot(page, "asset-form-errors");

    // Picking on the map fills both coordinates.
    const picker = page.getByTestId("location-picker").locator("canvas");
    await picker.waitFor();
    await page.waitForFunction(() => document.querySelector("[data-testid=location-picker] canvas") !== null);
    await picker.click({ position: { x: 200, y: 120 } });
    expect(Number.isFinite(Number(await form.getByLabel("Latitude (°)").inputValue()))).toBe(true);
    expect(await form.getByLabel("Latitude (°)").inputValue()).not.toBe("");
    expect(await form.getByLabel("Longitude (°)").inputValue()).not.toBe("");

    await form.getByLabel("Name").fill(name);
    await form.getByLabel("Kind").selectOption("footbridge");
    await form.getByLabel("Main span or height (m)").fill("24");
    await form.getByLabel("Material").fill("weathering steel");
    await form.getByLabel("Expected record interval (min)").fill("30");
    await form.getByLabel("Latitude (°)").fill("39.4172");
    await form.getByLabel("Longitude (°)").fill("-104.9021");
    await form.getByRole("button", { name: "Create asset" }).click();
    await page.waitForURL(/\/assets\/[0-9a-f-]{36}$/);
    expect(await page.getByTestId("asset-name").innerText()).toBe(name);

    await page.getByRole("link", { name: "Sensors" }).click();
    await page.waitForURL(/\/sensors$/);
    const addRow = page.locator("[data-channel-edit=new]");
    await addRow.getByLabel("Code").fill("DECK-01");
    await addRow.getByLabel("z (m)").fill("0.5");
    await addRow.getByRole("button", { name: "Add" }).click();
    await page.locator("[data-channel-row='DECK-01']").waitFor();

    await page.locator("[data-channel-edit=new]").getByLabel("Code").fill("DECK-01");
    await page.locator("[data-channel-edit=new]").getByRole("button", { name: "Add" }).click();
    const err = page.locator("#channel-new-code-error");
    await err.waitFor();
    expect(await err.innerText()).toMatch(/another channel of this asset has this code/i);
    expect(await page.locator("[data-channel-row='DECK-01']").count()).toBe(1);
    await screenshot(page, "sensors-duplicate-code");
  });
});
