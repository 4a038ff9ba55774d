/**
 * Queue an e-mail with file attachments through the mail queue. The attachments travel in the
 * job payload as base64 (a monthly PDF is tens of kilobytes).
 *
 * NOTE for the lead: `MailJob` in lib/jobs/queues.ts does not list `attachments` yet, so the
 * mail worker's `MailJob.parse` drops them; once `MailJob` accepts the `MailAttachment` array
 * below and lib/email/transport.ts hands it to nodemailer (see the H7 report), the PDF arrives.
 */
import { z } from "zod";
import { getQueue, MailJob, QUEUE_NAMES } from "@/lib/jobs/queues";

export const MailAttachment = z.object({
  filename: z.string().min(1).max(200),
  contentType: z.string().min(1).max(200),
  contentBase64: z.string().min(1),
});
export type MailAttachment = z.infer<typeof MailAttachment>;

/** Queue one message with attachments under `jobId` (a second call with the same id is ignored). */
export async function enqueueMailWithAttachments(message: MailJob, attachments: MailAttachment[], jobId: string): Promise<string> {
  if (jobId.includes(":")) throw new RangeError(`job ids must not contain ':' (got ${jobId})`);
  const data = { ...MailJob.parse(message), attachments: attachments.map((a) => MailAttachment.parse(a)) };
  const job = await getQueue(QUEUE_NAMES.mail).add("send", data, { jobId });
  return job.id ?? jobId;
}
