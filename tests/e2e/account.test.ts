import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";

describe("Account page", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
    const users = await readDemoSignIns(b.page, appUrl());
    await signIn(b.page, appUrl(), users.inspector.email, users.inspector.password);
    await b.page.waitForURL(`${appUrl()}/`);
    await b.page.goto(`${appUrl()}/account`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("changes the display name shown in the header", async () => {
    const { page } = b;
    const name = `Tomas Reyes ${Date.now().toString(36)}`;
    await page.getByLabel("Display name").fill(name);
    await page.getByRole("button", { name: "Save", exact: true }).click();
    await page.getByTestId("current-user").getByText(name).waitFor();
  });

  it("shows each password problem under its own field and changes nothing", async () => {
    const { page } = b;
    await page.getByLabel("Current password").fill("not-the-current-password");
    await page.getByLabel("New password", { exact: true }).fill("short");
    await page.getByLabel("Repeat new password").fill("different");
    await page.getByRole("button", { name: "Change password" }).click();
    await page.locator("#f-newPassword-error").waitFor();
    // Password rule of the issue: at least 12 characters.
    expect(await page.locator("#f-newPassword-error").innerText()).toMatch(/12 characters/);
    expect(await page.locator("#f-confirmPassword-error").innerText()).toMatch(/differ/);

    await page.getByLabel("New password", { exact: true }).fill("fernbrook-abutment-2026");
    await page.getByLabel("Repeat new password").fill("fernbrook-abutment-2026");
    await page.getByRole("button", { name: "Change password" }).click();
    await page.locator("#f-currentPassword-error").waitFor();
    expect(await page.locator("#f-currentPassword-error").innerText()).not.toBe("");
    await screenshot(page, "account-password-errors");
  });
});
