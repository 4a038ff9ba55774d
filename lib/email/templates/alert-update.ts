import { ALERT_CAUTION } from "./alert-raised";
import { layoutHtml, type RenderedEmail } from "./escape";

export interface AlertUpdateEmailData {
  kind: "assigned" | "closed";
  assetName: string;
  raisedAt: Date;
  actorName: string;
  /** Outcome and findings of a closed alert. */
  outcome?: string;
  findings?: string;
  link: string;
}

const utc = (d: Date) => `${d.toISOString().replace("T", " ").slice(0, 16)} UTC`;

/** E-mail on assignment (to the assignee) and on closure (to the asset's inspectors and engineers). */
export function alertUpdateEmail(d: AlertUpdateEmailData): RenderedEmail {
  const what = `the alert raised on ${d.assetName} at ${utc(d.raisedAt)}`;
  const lines = d.kind === "assigned"
    ? [`${d.actorName} assigned you ${what}.`, "Please open it, acknowledge it and schedule the inspection."]
    : [`${d.actorName} closed ${what} with the outcome ${(d.outcome ?? "").replace(/_/g, " ")}.`, `Findings: ${d.findings ?? ""}`];
  const caution = `Caution: ${ALERT_CAUTION}`;
  return {
    subject: d.kind === "assigned" ? `Alert assigned to you: ${d.assetName}` : `Alert closed: ${d.assetName}`,
    text: `${lines.join("\n\n")}\n\n${d.link}\n\n${caution}\n`,
    html: layoutHtml(lines, { href: d.link, label: "Open the alert" }, caution).replace(/<p style="margin:24px 0 0;font-size:12px;color:#7b8794">/, `<p style="margin:24px 0 0;font-size:13px;color:#1f2933">`),
  };
}
