/**
 * /dev/mail — the messages the local mail catcher has caught (development and tests only:
 * shown when MODEWARDEN_DEV_MAIL=1, which `npm start` and `npm test` set; 404 otherwise).
 * No session needed: it shows what the catcher on 127.0.0.1 holds, nothing of the database.
 */
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { z } from "zod";
import { env } from "@/lib/config/env";
import { Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Caught e-mail" };

const CaughtMail = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
type CaughtMail = z.infer<typeof CaughtMail>;

async function loadMessages(port: number): Promise<{ messages: CaughtMail[] } | { error: string }> {
  try {
    const res = await fetch(`http://127.0.0.1:${port}/messages`, { cache: "no-store" });
    if (!res.ok) return { error: `the catcher answered ${res.status}` };
    return { messages: z.array(CaughtMail).parse(await res.json()) };
  } catch {
    return { error: `no mail catcher on 127.0.0.1:${port}` };
  }
}

/** Plain text with its http(s) links made clickable. */
function linkify(text: string): ReactNode[] {
  return text.split(/(https?:\/\/[^\s<>"')]+)/g).map((part, i) =>
    i % 2 === 1 ? (
      <a key={i} href={part} className="text-accent underline underline-offset-2 break-all">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

export default async function CaughtMailPage() {
  await connection();
  const e = env();
  if (!e.MODEWARDEN_DEV_MAIL) notFound();
  const result = await loadMessages(e.MAIL_CATCHER_HTTP_PORT);

  return (
    <main className="mx-auto max-w-4xl space-y-4 px-6 py-8">
      <header>
        <h1 className="text-xl font-semibold tracking-tight">Caught e-mail</h1>
        <p className="text-sm text-muted">
          Every message the app sent through SMTP {e.SMTP_HOST}:{e.SMTP_PORT}, newest first. Nothing here left this machine.
        </p>
      </header>
      {"error" in result ? (
        <p role="alert" className="rounded-md border border-danger bg-danger-soft px-4 py-3 text-sm">
          {result.error}
        </p>
      ) : result.messages.length === 0 ? (
        <p className="text-sm text-muted">No messages yet.</p>
      ) : (
        <ol className="space-y-4" aria-label="Caught messages">
          {result.messages.map((m) => (
            <li key={m.id} data-testid="caught-mail">
              <Panel
                title={m.subject || "(no subject)"}
                actions={
                  <time dateTime={m.receivedAt} className="text-xs text-muted">
                    {m.receivedAt.replace("T", " ").slice(0, 19)} UTC
                  </time>
                }
              >
                <dl className="mb-3 grid grid-cols-[4rem_1fr] gap-x-2 text-sm">
                  <dt className="text-muted">From</dt>
                  <dd>{m.from}</dd>
                  <dt className="text-muted">To</dt>
                  <dd>{m.to.join(", ")}</dd>
                </dl>
                <pre className="whitespace-pre-wrap break-words font-sans text-sm">{linkify(m.text)}</pre>
              </Panel>
            </li>
          ))}
        </ol>
      )}
    </main>
  );
}
