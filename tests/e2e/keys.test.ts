import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { DEMO_ASSET_NAMES, fetchAssetsInPage, readDemoSignIns, screenshot, signIn } from "./flows";

describe("Keys shown once", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
    const users = await readDemoSignIns(b.page, appUrl());
    await signIn(b.page, appUrl(), users.admin.email, users.admin.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("lets an admin create a gateway, shows its key once, and revoke it", async () => {
    const { page } = b;
    const asset = (await fetchAssetsInPage(page)).find((a) => a.name === DEMO_ASSET_NAMES[1]);
    expect(asset).toBeDefined();
    await page.goto(`${appUrl()}/assets/${asset!.id}/gateways`);
    const name = `Abutment logger ${Date.now()}`;
    await page.getByLabel("New gateway name").fill(name);
    await page.getByRole("button", { name: "Create gateway" }).click();
    const secret = page.locator("[data-secret]");
    await secret.waitFor();
    const key = await secret.innerText();
    const row = page.locator(`[data-gateway-row="${name}"]`);
    await row.waitFor();
    // The list shows only the key's prefix, and that prefix is the start of the key shown.
    const prefix = (await row.locator("td").nth(1).innerText()).replace(/…$/, "");
    expect(prefix.length).toBeGreaterThan(4);
    expect(key.startsWith(prefix)).toBe(true);
    expect(key.length).toBeGreaterThan(prefix.length + 16);
    await screenshot(page, "gateway-key-once");

    await page.reload();
    await row.waitFor();
    expect(await page.locator("[data-secret]").count()).toBe(0);
    expect(await page.content()).not.toContain(key);

    page.once("dialog", (d) => void d.accept());
    await row.getByRole("button", { name: "Revoke" }).click();
    await row.getByText(/^Revoked/).waitFor();
  });

  it("creates a personal API token that authenticates /api/v1 until it is revoked", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/account`);
    const name = `nightly export ${Date.now()}`;
    await page.getByLabel("New token name").fill(name);
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = page.locator("[data-secret]");
    await secret.waitFor();
    const token = await secret.innerText();
    await screenshot(page, "account-token-once");

    // Outside the browser, with no cookie: only the bearer token.
    const ok = await fetch(`${appUrl()}/api/v1/assets`, { headers: { authorization: `Bearer ${token}` } });
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { assets: Array<{ name: string }> };
    expect(body.assets.map((a) => a.name)).toEqual(expect.arrayContaining([...DEMO_ASSET_NAMES]));

    const row = page.locator(`[data-token-row="${name}"]`);
    page.once("dialog", (d) => void d.accept());
    await row.getByRole("button", { name: "Revoke" }).click();
    await row.getByText("Revoked").waitFor();
    const refused = await fetch(`${appUrl()}/api/v1/assets`, { headers: { authorization: `Bearer ${token}` } });
    expect(refused.status).toBe(401);
  });
});
