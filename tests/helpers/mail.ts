/**
 * Reading the local mail catcher (scripts/mail-catcher.ts) from integration and e2e tests:
 * its HTTP JSON listing on 127.0.0.1:MAIL_CATCHER_HTTP_PORT.
 */
import { env } from "@/lib/config/env";
import type { CaughtMail } from "../../scripts/mail-catcher";
import { assertTestStack } from "./guard";

export type { CaughtMail };

function catcherUrl(path: string): string {
  return `http://127.0.0.1:${env().MAIL_CATCHER_HTTP_PORT}${path}`;
}

/** Every caught message, newest first. */
export async function caughtMails(): Promise<CaughtMail[]> {
  const res = await fetch(catcherUrl("/messages"), { cache: "no-store" });
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

/** Forget every caught message (call in beforeEach of tests that count e-mails). */
export async function clearMails(): Promise<void> {
  assertTestStack();
  const res = await fetch(catcherUrl("/messages"), { method: "DELETE" });
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
}

/**
 * Wait until a message matching `match` has been caught (mail goes through the queue and the
 * worker, so it arrives a moment after the request). Polls every 200 ms; throws after timeoutMs.
 */
export async function waitForMail(match: (m: CaughtMail) => boolean, { timeoutMs = 20_000 } = {}): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await caughtMails()).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no matching e-mail caught within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The http(s) links in a message's text part, in order. */
export function linksIn(mail: CaughtMail): string[] {
  return mail.text.match(/https?:\/\/[^\s<>"')]+/g) ?? [];
}
