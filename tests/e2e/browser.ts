/**
 * Debian's chromium through playwright-core, one fresh profile per call (STACK.md: default
 * flags give WebGL through SwiftShader headless). Settings come from lib/config/env.ts.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { env } from "@/lib/config/env";

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

export function appUrl(): string {
  return env().APP_URL.replace(/\/$/, "");
}

export function catcherUrl(): string {
  return `http://127.0.0.1:${env().MAIL_CATCHER_HTTP_PORT}`;
}

export async function openBrowser(): Promise<BrowserSession> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "mw-e2e-"));
  const context = await chromium.launchPersistentContext(path.join(dir, "profile"), {
    executablePath: env().CHROMIUM_PATH,
    headless: true,
    viewport: { width: 1400, height: 900 },
    args: ["--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    env: { HOME: dir, XDG_CACHE_HOME: path.join(dir, "cache"), XDG_CONFIG_HOME: path.join(dir, "config") },
  });
  // Functions handed to page.evaluate are compiled by esbuild, which may wrap them in __name().
  await context.addInitScript("globalThis.__name = (f) => f;");
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(30_000);
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
