/**
 * Local mail catcher for development and tests: accepts every message over SMTP on
 * 127.0.0.1:SMTP_PORT, stores it as JSON under <MODEWARDEN_DATA_DIR>/mail and serves
 *   GET    /messages        all caught messages, newest first
 *   GET    /messages/:id    one message
 *   DELETE /messages        forget every message
 * on 127.0.0.1:MAIL_CATCHER_HTTP_PORT. The app's /dev/mail page and the tests read it.
 */
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import crypto from "node:crypto";
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { env } from "../lib/config/env";

export interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  /** Envelope recipients (RCPT TO), lower-cased. */
  to: string[];
  subject: string;
  date: string | null;
  text: string;
  html: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
}

const e = env();
const mailDir = path.resolve(e.MODEWARDEN_DATA_DIR, "mail");
fs.mkdirSync(mailDir, { recursive: true });

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(", ");
}

function readAll(): CaughtMail[] {
  const files = fs.readdirSync(mailDir).filter((f) => f.endsWith(".json")).sort().reverse();
  const out: CaughtMail[] = [];
  for (const f of files) {
    try {
      out.push(JSON.parse(fs.readFileSync(path.join(mailDir, f), "utf8")) as CaughtMail);
    } catch {
      // A file being written right now; the next listing will have it.
    }
  }
  return out;
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  logger: false,
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        const receivedAt = new Date();
        const id = `${receivedAt.getTime()}-${crypto.randomBytes(4).toString("hex")}`;
        const mail: CaughtMail = {
          id,
          receivedAt: receivedAt.toISOString(),
          from: addressText(parsed.from) || (session.envelope.mailFrom ? session.envelope.mailFrom.address : ""),
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: parsed.subject ?? "",
          date: parsed.date ? parsed.date.toISOString() : null,
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : null,
          attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
        };
        // Write then rename, so a reader never sees half a file.
        const file = path.join(mailDir, `${id}.json`);
        fs.writeFileSync(`${file}.tmp`, JSON.stringify(mail, null, 2));
        fs.renameSync(`${file}.tmp`, file);
        console.log(`caught "${mail.subject}" for ${mail.to.join(", ")}`);
        callback();
      })
      .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
  },
});

function send(res: http.ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" });
  res.end(body === undefined ? "" : JSON.stringify(body));
}

const web = http.createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://127.0.0.1");
  const m = url.pathname.match(/^\/messages(?:\/([A-Za-z0-9-]+))?\/?$/);
  if (url.pathname === "/health") return send(res, 200, { ok: true });
  if (!m) return send(res, 404, { error: "not found" });
  if (req.method === "GET" && !m[1]) return send(res, 200, readAll());
  if (req.method === "GET") {
    const file = path.join(mailDir, `${m[1]}.json`);
    if (!fs.existsSync(file)) return send(res, 404, { error: "not found" });
    return send(res, 200, JSON.parse(fs.readFileSync(file, "utf8")));
  }
  if (req.method === "DELETE" && !m[1]) {
    for (const f of fs.readdirSync(mailDir)) fs.rmSync(path.join(mailDir, f), { force: true });
    res.writeHead(204).end();
    return;
  }
  return send(res, 405, { error: "method not allowed" });
});

smtp.on("error", (err) => console.error(`smtp: ${err.message}`));
smtp.listen(e.SMTP_PORT, "127.0.0.1", () => {
  web.listen(e.MAIL_CATCHER_HTTP_PORT, "127.0.0.1", () => {
    console.log(`SMTP on 127.0.0.1:${e.SMTP_PORT}, messages on http://127.0.0.1:${e.MAIL_CATCHER_HTTP_PORT}/messages`);
  });
});

function shutdown(): void {
  web.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
