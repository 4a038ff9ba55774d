import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { DEMO_ASSET_NAMES, fetchAssetsInPage, readDemoSignIns, screenshot, signIn } from "./flows";

const EDIT_BUTTONS = /^(New asset|Edit asset|Edit|Add|Deactivate|Create gateway|Revoke|Send invitation|Change|Remove|Withdraw)$/;

describe("An owner", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
    const users = await readDemoSignIns(b.page, appUrl());
    await signIn(b.page, appUrl(), users.owner.email, users.owner.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  async function editControls(): Promise<string[]> {
    const names: string[] = [];
    for (const role of ["button", "link"] as const) {
      for (const el of await b.page.getByRole(role, { name: EDIT_BUTTONS }).all()) names.push(await el.innerText());
    }
    return names;
  }

  it("sees no edit controls on the Portfolio, the asset sections or the Team page", async () => {
    const { page } = b;
    await page.getByTestId("asset-table").locator("[data-asset-row]").first().waitFor();
    expect(await editControls()).toEqual([]);

    const asset = (await fetchAssetsInPage(page)).find((a) => a.name === DEMO_ASSET_NAMES[0]);
    expect(asset).toBeDefined();
    for (const section of ["", "/sensors", "/gateways"]) {
      await page.goto(`${appUrl()}/assets/${asset!.id}${section}`);
      await page.getByTestId("asset-name").waitFor();
      expect(await editControls(), `controls on ${section || "overview"}`).toEqual([]);
    }
    await page.goto(`${appUrl()}/assets/${asset!.id}/sensors`);
    expect(await page.locator("[data-channel-row]").count()).toBeGreaterThan(0);
    expect(await page.locator("input, select").count()).toBe(0);
    await screenshot(page, "owner-sensors");

    await page.goto(`${appUrl()}/team`);
    await page.locator("[data-member-row]").first().waitFor();
    expect(await editControls()).toEqual([]);
    expect(await page.getByTestId("invite-form").count()).toBe(0);
    await screenshot(page, "owner-team");
  });

  it("is sent back to the Portfolio from the new-asset form", async () => {
    await b.page.goto(`${appUrl()}/assets/new`);
    await b.page.waitForURL(`${appUrl()}/`);
    expect(await b.page.getByTestId("asset-form").count()).toBe(0);
  });
});
