/**
 * The monthly report (issue 6 part 4): for every asset of every organisation that has owners,
 * the PDF report of the previous calendar month (UTC), e-mailed to each owner through the
 * mail queue with the PDF attached. Each mail job is keyed by asset, month and recipient, so
 * a retried or repeated run sends nothing twice while the keyed jobs are kept.
 */
import { db } from "@/lib/db/knex";
import { listMemberAddresses } from "@/lib/db/repos/alert.repo";
import { listAssetsOfOrganisation } from "@/lib/db/repos/asset.repo";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import { listOrganisationIdsWithOwners } from "@/lib/db/repos/report.repo";
import type { Actor } from "@/lib/domain/types";
import { monthlyReportEmail } from "@/lib/email/templates/monthly-report";
import { summariseReport } from "@/lib/reports/summary";
import { enqueueMailWithAttachments } from "./report-mail";
import { renderAssetReport } from "./report-pdf.service";
import { previousMonth, type ReportPeriod } from "./report.service";

export interface MonthlyRunOutcome {
  month: string;
  assets: number;
  mails: number;
  /** Assets whose report failed, with the reason (the others are still sent). */
  failures: { assetId: string; message: string }[];
}

/** "2026-10" → that month as a period; without a month, the month before `nowMs`. */
export function monthPeriod(month: string | undefined, nowMs: number): ReportPeriod & { label: string } {
  if (!month) return previousMonth(nowMs);
  const [y, m] = month.split("-").map(Number);
  return { from: new Date(Date.UTC(y, m - 1, 1)), to: new Date(Date.UTC(y, m, 1)), label: month };
}

/**
 * Send the monthly reports (see the file header). `organisationIds` limits the run (tests,
 * a manual resend); by default every organisation with an enabled owner.
 */
export async function sendMonthlyReports(opts: { month?: string; nowMs?: number; organisationIds?: string[] } = {}): Promise<MonthlyRunOutcome> {
  const nowMs = opts.nowMs ?? Date.now();
  const period = monthPeriod(opts.month, nowMs);
  const orgIds = opts.organisationIds ?? (await listOrganisationIdsWithOwners(db()));
  const out: MonthlyRunOutcome = { month: period.label, assets: 0, mails: 0, failures: [] };
  for (const organisationId of orgIds) {
    const [org, owners, assets] = await Promise.all([
      findOrganisationById(db(), organisationId),
      listMemberAddresses(db(), organisationId, ["owner"]),
      listAssetsOfOrganisation(db(), organisationId),
    ]);
    if (!org || owners.length === 0) continue;
    // The report is read as the first owner sees it (portfolio:read in their organisation).
    const actor: Actor = { userId: owners[0].userId, organisationId, role: "owner", via: "session" };
    for (const asset of assets) {
      try {
        const r = await renderAssetReport(actor, asset.id, period, { nowMs });
        const s = summariseReport(r.report);
        const message = monthlyReportEmail({
          organisationName: org.name, assetName: r.report.asset.name, month: period.label, conditionWord: s.conditionWord,
          condition: s.condition, found: s.found, done: s.done, link: r.report.link, attachmentName: r.filename,
        });
        const attachment = { filename: r.filename, contentType: "application/pdf", contentBase64: r.pdf.toString("base64") };
        for (const o of owners) {
          await enqueueMailWithAttachments({ to: o.email, ...message }, [attachment], `monthly-report-${asset.id}-${period.label}-${o.userId}`);
          out.mails += 1;
        }
        out.assets += 1;
      } catch (e) {
        out.failures.push({ assetId: asset.id, message: e instanceof Error ? e.message : String(e) });
      }
    }
  }
  return out;
}
