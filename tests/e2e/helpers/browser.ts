/**
 * The browser harness of the e2e tests (STACK.md): Debian's chromium through playwright-core,
 * a persistent context in a fresh temporary profile per call, XDG folders inside it, and the
 * `__name` shim that esbuild-compiled functions passed to page.evaluate need.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { env } from "@/lib/config/env";

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** Close the browser and delete its profile folder. */
  close: () => Promise<void>;
}

/** Flags from STACK.md: no network chatter, no first-run UI; WebGL still works (SwiftShader). */
export const CHROMIUM_ARGS = [
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

/** The app under test (APP_URL, set by scripts/test.mjs to the test app), without a trailing slash. */
export function appUrl(): string {
  return env().APP_URL.replace(/\/$/, "");
}

/** Launch chromium with a fresh profile; `baseURL` is the app, so `page.goto("/sign-in")` works. */
export async function openBrowser(options: { viewport?: { width: number; height: number } } = {}): Promise<BrowserSession> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "mw-e2e-"));
  const context = await chromium.launchPersistentContext(path.join(dir, "profile"), {
    executablePath: env().CHROMIUM_PATH,
    headless: true,
    baseURL: appUrl(),
    viewport: options.viewport ?? { width: 1400, height: 900 },
    args: CHROMIUM_ARGS,
    env: {
      ...process.env,
      HOME: dir,
      XDG_CACHE_HOME: path.join(dir, "cache"),
      XDG_CONFIG_HOME: path.join(dir, "config"),
      XDG_DATA_HOME: path.join(dir, "data"),
    },
  });
  await context.addInitScript("globalThis.__name = (f) => f;");
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(30_000);
  return {
    context,
    page,
    close: async () => {
      await context.close().catch(() => {});
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Alias kept for readability in tests that launch several browsers. */
export const launchBrowser = openBrowser;
