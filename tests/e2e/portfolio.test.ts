import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES } from "@/lib/auth/permissions";
import { CONDITION_STYLES } from "@/components/condition/conditions";
import type { AssetCondition } from "@/lib/domain/types";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import {
  countColourPixels, DEMO_ASSET_NAMES, fetchAssetsInPage, readDemoSignIns, screenshot, signIn, waitForRenderedAssets,
} from "./flows";

describe("Portfolio", () => {
  let b: BrowserSession;
  let users: Record<string, { email: string; password: string }>;

  beforeAll(async () => {
    b = await openBrowser();
    users = await readDemoSignIns(b.page, appUrl());
  });
  afterAll(async () => {
    await b?.close();
  });

  it("lists one demo sign-in per role on the sign-in page (demo mode)", () => {
    expect(Object.keys(users).sort()).toEqual([...ROLES].sort());
  });

  for (const role of ROLES) {
    it(`shows the ${role} every asset on the map and in the table, the five demo assets among them`, async () => {
      const { page, context } = b;
      await context.clearCookies();
      await signIn(page, appUrl(), users[role].email, users[role].password);
      await page.waitForURL(`${appUrl()}/`);
      expect((await page.getByTestId("current-role").innerText()).toLowerCase()).toBe(role);

      const assets = await fetchAssetsInPage(page);
      const names = assets.map((a) => a.name);
      for (const n of DEMO_ASSET_NAMES) expect(names).toContain(n);

      // Table: one row per asset from /api/v1/assets.
      await page.locator("[data-asset-row]").nth(assets.length - 1).waitFor();
      expect(await page.locator("[data-asset-row]").count()).toBe(assets.length);
      const tableText = await page.getByTestId("asset-table").innerText();
      for (const n of DEMO_ASSET_NAMES) expect(tableText).toContain(n);

      // Map: MapLibre's own count of drawn markers (queryRenderedFeatures), then the pixels.
      expect(await waitForRenderedAssets(page, assets.length)).toBe(assets.length);
      // Overlays (legend dots, locator) would add their own coloured pixels: hide them first.
      await page.addStyleTag({ content: "[data-testid=map-legend],[data-testid=map-locator]{visibility:hidden}" });
      const png = await page.locator("[data-testid=portfolio-map] canvas").screenshot();
      const present = [...new Set(assets.map((a) => a.condition as AssetCondition))].filter((c) => !CONDITION_STYLES[c].outline);
      const counts = await countColourPixels(page, png, Object.fromEntries(present.map((c) => [c, CONDITION_STYLES[c].fill])));
      // A marker is a disc of radius ≥ 5 px, so each condition present paints well over 20 pixels.
      for (const c of present) expect(counts[c], `pixels painted in the ${c} colour`).toBeGreaterThan(20);
      await page.addStyleTag({ content: "[data-testid=map-legend],[data-testid=map-locator]{visibility:visible}" });
      await screenshot(page, `portfolio-${role}`);
    });
  }

  it("opens a card linking to the asset when a marker is clicked", async () => {
    const { page } = b;
    const assets = await fetchAssetsInPage(page);
    const target = assets.find((a) => a.name === DEMO_ASSET_NAMES[2]);
    expect(target).toBeDefined();
    // The asset's screen position, projected by MapLibre's own transform (set by the map).
    const positions = JSON.parse((await page.getByTestId("portfolio-map").getAttribute("data-marker-positions")) || "{}") as Record<string, { x: number; y: number }>;
    const point = positions[target!.id] ?? null;
    expect(point).not.toBeNull();
    const box = await page.locator("[data-testid=portfolio-map] canvas").boundingBox();
    await page.mouse.click(box!.x + point!.x, box!.y + point!.y);
    const card = page.getByTestId("map-card");
    await card.waitFor();
    expect(await card.innerText()).toContain(target!.name);
    await screenshot(page, "portfolio-card");
    await card.getByRole("link", { name: /Open asset/ }).click();
    await page.waitForURL(`${appUrl()}/assets/${target!.id}`);
    expect(await page.getByTestId("asset-name").innerText()).toBe(target!.name);
  });
});
