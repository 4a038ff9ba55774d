/** Reading the local mail catcher (scripts/mail-catcher.ts) from tests. */
import { env } from "@/lib/config/env";

export interface CaughtMail { id: string; to: string[]; subject: string; text: string; html: string | null }

export async function listCaughtMail(): Promise<CaughtMail[]> {
  const res = await fetch(`http://127.0.0.1:${env().MAIL_CATCHER_HTTP_PORT}/messages`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

/** Wait until a message to `to` whose subject matches arrives (polls; gives up after `withinMs`). */
export async function waitForMail(to: string, subject: RegExp, withinMs = 20_000): Promise<CaughtMail> {
  const deadline = Date.now() + withinMs;
  for (;;) {
    const found = (await listCaughtMail()).find((m) => m.to.includes(to.toLowerCase()) && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} matching ${subject} within ${withinMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The first link in a text part that starts with `${APP_URL}${path}`; its last segment is the token. */
export function linkIn(text: string, path: string): { url: string; token: string } {
  const base = env().APP_URL.replace(/\/$/, "");
  const m = new RegExp(`${base.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}${path}/([A-Za-z0-9_-]+)`).exec(text);
  if (!m) throw new Error(`no ${path} link in the message`);
  return { url: m[0], token: m[1] };
}
