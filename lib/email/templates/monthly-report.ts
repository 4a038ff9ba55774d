import { REPORT_CAUTION } from "@/lib/reports/caution";
import { escapeHtml, type RenderedEmail } from "./escape";

export interface MonthlyReportEmailData {
  organisationName: string;
  assetName: string;
  /** "2026-10". */
  month: string;
  conditionWord: string;
  condition: string;
  found: string[];
  done: string[];
  link: string;
  attachmentName: string;
}

/**
 * The monthly report e-mail to an organisation's owners: the plain-language summary of one
 * asset for the month, the link to the asset and the caution; the PDF report travels as an
 * attachment (added by lib/services/reports/monthly.service.ts).
 */
export function monthlyReportEmail(d: MonthlyReportEmailData): RenderedEmail {
  const intro = `Monthly report for ${d.assetName} (${d.organisationName}), ${d.month}. The full report is attached (${d.attachmentName}).`;
  const cond = `Condition: ${d.conditionWord}. ${d.condition}`;
  const text = [
    intro, cond,
    ["What was found:", ...d.found.map((l) => `- ${l}`)].join("\n"),
    ["What was done:", ...d.done.map((l) => `- ${l}`)].join("\n"),
    d.link, `Caution: ${REPORT_CAUTION}`,
  ].join("\n\n") + "\n";
  const list = (items: string[]) => `<ul style="margin:0 0 12px">${items.map((l) => `<li>${escapeHtml(l)}</li>`).join("")}</ul>`;
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1f2933;line-height:1.5">`
    + `<div style="max-width:600px;margin:24px auto"><p style="margin:0 0 12px">${escapeHtml(intro)}</p>`
    + `<p style="margin:0 0 12px"><strong>${escapeHtml(`Condition: ${d.conditionWord}.`)}</strong> ${escapeHtml(d.condition)}</p>`
    + `<p style="margin:0 0 6px">What was found:</p>${list(d.found)}<p style="margin:0 0 6px">What was done:</p>${list(d.done)}`
    + `<p style="margin:20px 0"><a href="${escapeHtml(d.link)}" style="background:#0f766e;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">Open the asset</a></p>`
    + `<p style="margin:0 0 12px;font-size:13px;color:#52606d">If the button does not work, open this address: ${escapeHtml(d.link)}</p>`
    + `<p style="margin:24px 0 0;padding:12px;border-left:4px solid #b45309;background:#fffbeb;font-size:13px"><strong>Caution.</strong> ${escapeHtml(REPORT_CAUTION)}</p>`
    + `</div></body></html>`;
  return { subject: `Monthly report ${d.month}: ${d.assetName}`, text, html };
}
