import { ALERT_CAUTION } from "./alert-raised";
import { escapeHtml, type RenderedEmail } from "./escape";

export interface AlertUpdateEmailData {
  kind: "assigned" | "closed";
  assetName: string;
  raisedAt: Date;
  actorName: string;
  /** Outcome and findings of a closed alert. */
  outcome?: string;
  findings?: string;
  /** Evidence summary lines of the alert (rule, modes beyond with residual and limits, T²). */
  evidence: string[];
  link: string;
}

const utc = (d: Date) => `${d.toISOString().replace("T", " ").slice(0, 16)} UTC`;

/** E-mail on assignment (to the assignee) and on closure (to the asset's inspectors and engineers). */
export function alertUpdateEmail(d: AlertUpdateEmailData): RenderedEmail {
  const what = `the alert raised on ${d.assetName} at ${utc(d.raisedAt)}`;
  const lines = d.kind === "assigned"
    ? [`${d.actorName} assigned you ${what}.`, "Please open it, acknowledge it and schedule the inspection."]
    : [`${d.actorName} closed ${what} with the outcome ${(d.outcome ?? "").replace(/_/g, " ")}.`, `Findings: ${d.findings ?? ""}`];
  const evidenceTitle = "Evidence when the alert was raised:";
  const text = [
    ...lines, [evidenceTitle, ...d.evidence.map((l) => `- ${l}`)].join("\n"), d.link, `Caution: ${ALERT_CAUTION}`,
  ].join("\n\n") + "\n";
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1f2933;line-height:1.5">`
    + `<div style="max-width:600px;margin:24px auto">`
    + lines.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("")
    + `<p style="margin:0 0 6px">${escapeHtml(evidenceTitle)}</p><ul style="margin:0 0 12px">`
    + d.evidence.map((l) => `<li>${escapeHtml(l)}</li>`).join("") + `</ul>`
    + `<p style="margin:20px 0"><a href="${escapeHtml(d.link)}" style="background:#0f766e;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">Open the alert</a></p>`
    + `<p style="margin:0 0 12px;font-size:13px;color:#52606d">If the button does not work, open this address: ${escapeHtml(d.link)}</p>`
    + `<p style="margin:24px 0 0;padding:12px;border-left:4px solid #b45309;background:#fffbeb;font-size:13px"><strong>Caution.</strong> ${escapeHtml(ALERT_CAUTION)}</p>`
    + `</div></body></html>`;
  return { subject: d.kind === "assigned" ? `Alert assigned to you: ${d.assetName}` : `Alert closed: ${d.assetName}`, text, html };
}
