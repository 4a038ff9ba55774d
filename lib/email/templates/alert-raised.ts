import { cautionText } from "@/lib/domain/caution";
import { escapeHtml, type RenderedEmail } from "./escape";

/**
 * The caution of PRODUCT.md, in our words: shown on alerts, in e-mails and in reports.
 * Exported so the alert pages show the same text.
 */
export const ALERT_CAUTION = cautionText("alert");

export interface AlertRaisedModeLine { label: string; residualHz: number; lowerLimitHz: number; upperLimitHz: number; residualPct: number | null }

export interface AlertRaisedEmailData {
  organisationName: string;
  assetName: string;
  raisedAt: Date;
  rule: string;
  modes: AlertRaisedModeLine[];
  t2: { value: number; ucl: number } | null;
  baselineVersion: number;
  link: string;
}

const fmtHz = (v: number) => `${v >= 0 ? "+" : "−"}${Math.abs(v).toFixed(4)} Hz`;
const utc = (d: Date) => `${d.toISOString().replace("T", " ").slice(0, 16)} UTC`;

/** The e-mail sent to the asset's inspectors and engineers when an alert is raised. */
export function alertRaisedEmail(d: AlertRaisedEmailData): RenderedEmail {
  const intro = `Modewarden raised an alert on ${d.assetName} (${d.organisationName}) at ${utc(d.raisedAt)}: ${d.rule}.`;
  const modeLines = d.modes.map((m) => !Number.isFinite(m.residualHz) ? `${m.label}: not identified that day` :
    `${m.label}: daily residual ${fmtHz(m.residualHz)}${m.residualPct === null ? "" : ` (${m.residualPct >= 0 ? "+" : "−"}${Math.abs(m.residualPct).toFixed(2)} %)`}, `
    + `limits ${fmtHz(m.lowerLimitHz)} to ${fmtHz(m.upperLimitHz)}`);
  const t2 = d.t2 ? `Hotelling T² of all tracked modes: ${d.t2.value.toFixed(2)} (limit ${d.t2.ucl.toFixed(2)}).` : null;
  const evidence = [`Evidence after temperature compensation with baseline version ${d.baselineVersion}:`, ...modeLines, ...(t2 ? [t2] : [])];
  const ask = "Please open the alert, acknowledge it and arrange an inspection.";
  const text = [intro, evidence.join("\n"), ask, d.link, `Caution: ${ALERT_CAUTION}`].join("\n\n") + "\n";
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1f2933;line-height:1.5">`
    + `<div style="max-width:600px;margin:24px auto"><p style="margin:0 0 12px">${escapeHtml(intro)}</p>`
    + `<p style="margin:0 0 6px">${escapeHtml(evidence[0])}</p><ul style="margin:0 0 12px">`
    + evidence.slice(1).map((l) => `<li>${escapeHtml(l)}</li>`).join("") + `</ul>`
    + `<p style="margin:0 0 12px">${escapeHtml(ask)}</p>`
    + `<p style="margin:20px 0"><a href="${escapeHtml(d.link)}" style="background:#b91c1c;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">Open the alert</a></p>`
    + `<p style="margin:0 0 12px;font-size:13px;color:#52606d">If the button does not work, open this address: ${escapeHtml(d.link)}</p>`
    + `<p style="margin:24px 0 0;padding:12px;border-left:4px solid #b45309;background:#fffbeb;font-size:13px"><strong>Caution.</strong> ${escapeHtml(ALERT_CAUTION)}</p>`
    + `</div></body></html>`;
  return { subject: `Alert: ${d.assetName}: drift beyond its limits`, text, html };
}
