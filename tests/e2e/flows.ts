/**
 * Page-level steps shared by the browser tests (sign in, read the demo sign-ins, wait for the
 * map, read canvas pixels). The browser and the stack come from the harness in ./helpers.
 */
import fs from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";


/** The five demo assets of PRODUCT.md's scenario (names chosen by the seed, see db/seeds). */

export const SCREEN_DIR = path.resolve(".tmp/screens");

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREEN_DIR, { recursive: true });
  const file = path.join(SCREEN_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

export async function signIn(page: Page, appUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** Sign in as the demo user of `role` (read from the sign-in page) and wait for the portfolio. */
export async function signInAsDemo(page: Page, appUrl: string, role: "admin" | "engineer" | "inspector" | "owner"): Promise<void> {
  const user = (await readDemoSignIns(page, appUrl))[role];
  await signIn(page, appUrl, user.email, user.password);
  await page.waitForURL(`${appUrl}/`);
}

export async function signOut(page: Page): Promise<void> {
  await page.getByRole("button", { name: "Sign out" }).click();
  await page.waitForURL(/\/sign-in/);
}

/** The demo sign-ins as listed on the sign-in page in demo mode: role → { email, password }. */
export async function readDemoSignIns(page: Page, appUrl: string): Promise<Record<string, { email: string; password: string }>> {
  await page.goto(`${appUrl}/sign-in`);
  const box = page.getByTestId("demo-sign-ins");
  await box.waitFor();
  const out: Record<string, { email: string; password: string }> = {};
  const rows = box.locator("li");
  const n = await rows.count();
  for (let i = 0; i < n; i++) {
    const row = rows.nth(i);
    const role = (await row.locator("span.capitalize").innerText()).trim().toLowerCase();
    await row.getByRole("button", { name: "Use" }).click();
    out[role] = {
      email: await page.getByLabel("E-mail").inputValue(),
      password: await page.getByLabel("Password", { exact: true }).inputValue(),
    };
  }
  return out;
}

/** Wait until MapLibre reports that it drew `count` distinct asset markers; returns the count. */
export async function waitForRenderedAssets(page: Page, count: number): Promise<number> {
  const map = page.getByTestId("portfolio-map");
  await map.waitFor();
  await page.waitForFunction(
    (n) => document.querySelector("[data-testid=portfolio-map]")?.getAttribute("data-rendered-assets") === String(n),
    count,
    { timeout: 60_000 },
  );
  return Number(await map.getAttribute("data-rendered-assets"));
}

/** The five assets of PRODUCT.md's demo scenario, as named in foundation-spec.md. */
export const DEMO_ASSET_NAMES = [
  "Millrace Footbridge",
  "Fernbrook Timber Footbridge",
  "Heron Reach Cable-Stayed Footbridge",
  "Carrow Hill Telecom Mast",
  "Quarry Lane Lighting Tower",
] as const;

/** `GET /api/v1/assets` with the page's session: the list the Portfolio is drawn from. */
export async function fetchAssetsInPage(page: Page): Promise<Array<{ id: string; name: string; condition: string }>> {
  return page.evaluate(async () => {
    const res = await fetch("/api/v1/assets", { headers: { accept: "application/json" } });
    const body = (await res.json()) as { assets: Array<{ id: string; name: string; condition: string }> };
    return body.assets;
  });
}

function hexToRgb(hex: string): [number, number, number] {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/**
 * Count pixels of a PNG (decoded by the browser) within `tolerance` (per channel) of each colour.
 * Used to read back the map canvas: markers must really be painted in their condition colour.
 */
export async function countColourPixels(page: Page, png: Buffer, colours: Record<string, string>, tolerance = 12): Promise<Record<string, number>> {
  const targets = Object.entries(colours).map(([k, hex]) => [k, hexToRgb(hex)] as const);
  return page.evaluate(
    async ({ b64, targets, tolerance }) => {
      const img = new Image();
      img.src = `data:image/png;base64,${b64}`;
      await img.decode();
      const c = document.createElement("canvas");
      c.width = img.naturalWidth;
      c.height = img.naturalHeight;
      const ctx = c.getContext("2d");
      if (!ctx) throw new Error("no 2d context");
      ctx.drawImage(img, 0, 0);
      const d = ctx.getImageData(0, 0, c.width, c.height).data;
      const counts: Record<string, number> = {};
      for (const [k] of targets) counts[k] = 0;
      for (let i = 0; i < d.length; i += 4) {
        for (const [k, [r, g, b]] of targets) {
          if (Math.abs(d[i] - r) <= tolerance && Math.abs(d[i + 1] - g) <= tolerance && Math.abs(d[i + 2] - b) <= tolerance) counts[k]++;
        }
      }
      return counts;
    },
    { b64: png.toString("base64"), targets, tolerance },
  );
}
