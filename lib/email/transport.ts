/**
 * The SMTP transport (the local catcher in development and tests). Only the mail worker
 * sends; requests enqueue (CONVENTIONS §5).
 */
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/config/env";

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Files as base64 (the mail job's payload form). */
  attachments?: { filename: string; contentType: string; contentBase64: string }[];
}

let transporter: Transporter | null = null;

export function mailTransport(): Transporter {
  if (!transporter) {
    const e = env();
    transporter = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: false,
      // The local catcher speaks plain SMTP; a real relay configured here may offer STARTTLS.
      ignoreTLS: e.NODE_ENV !== "production",
    });
  }
  return transporter;
}

/** Send one message now (the mail worker calls this). */
export async function sendMail(message: MailMessage): Promise<{ messageId: string }> {
  const { attachments, ...rest } = message;
  const info = await mailTransport().sendMail({
    from: env().MAIL_FROM,
    ...rest,
    ...(attachments?.length
      ? { attachments: attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, "base64") })) }
      : {}),
  });
  return { messageId: String(info.messageId) };
}

/** Close pooled connections (worker shutdown). */
export function closeMailTransport(): void {
  transporter?.close();
  transporter = null;
}
