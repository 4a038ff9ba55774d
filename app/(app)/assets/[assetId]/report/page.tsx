import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { isAppError } from "@/lib/http/errors";
import { pngDataUrl } from "@/lib/reports/png";
import type { AssetReport } from "@/lib/reports/report-data";
import { renderReportCharts } from "@/lib/reports/report-charts";
import { defaultPeriod, getAssetReport } from "@/lib/services/reports/report.service";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { PrintButton } from "./_components/print-button";
import { ReportView, type ReportChartImage } from "./_components/report-view";

export const metadata: Metadata = { title: "Report" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
const DAY = 86_400_000;
const day = (d: Date) => d.toISOString().slice(0, 10);

/** `from`/`to` as UTC days (both inclusive) from the URL; default the last 30 days. */
function resolvePeriod(sp: Search): { from: Date; to: Date; error?: string } {
  const d = defaultPeriod();
  const parse = (s: string | undefined) => (s && /^\d{4}-\d{2}-\d{2}$/.test(s) ? new Date(`${s}T00:00:00Z`) : null);
  const fromS = one(sp.from);
  const toS = one(sp.to);
  const from = fromS ? parse(fromS) : new Date(Date.UTC(d.from.getUTCFullYear(), d.from.getUTCMonth(), d.from.getUTCDate()));
  const toDay = toS ? parse(toS) : new Date(Date.UTC(d.to.getUTCFullYear(), d.to.getUTCMonth(), d.to.getUTCDate()));
  if (!from || !toDay || Number.isNaN(from.getTime()) || Number.isNaN(toDay.getTime())) return { ...d, error: "Use days such as 2026-03-01." };
  const to = new Date(toDay.getTime() + DAY);
  if (from >= to) return { ...d, error: "The last day must not be before the first." };
  return { from, to };
}

/**
 * Asset › Report: the asset report of a period on screen, print-friendly, with the same
 * content and images as the PDF (lib/reports), a "Download PDF" link and the exports.
 */
export default async function ReportPage({ params, searchParams }: { params: Promise<{ assetId: string }>; searchParams: Promise<Search> }) {
  await connection();
  const [{ assetId }, sp] = await Promise.all([params, searchParams]);
  const actor = await pageActor();
  const period = resolvePeriod(sp);
  let error = period.error;
  let report: AssetReport;
  try {
    report = await orNotFound(getAssetReport(actor, assetId, { from: period.from, to: period.to }));
  } catch (e) {
    if (!isAppError(e) || e.code !== "unprocessable") throw e;
    error = e.message;
    const d = defaultPeriod();
    report = await orNotFound(getAssetReport(actor, assetId, d));
  }
  const charts: ReportChartImage[] = renderReportCharts(report).map((c) => ({
    key: `${c.trackedModeId}-${c.kind}`, title: c.title, caption: c.caption, src: pngDataUrl(c.png), width: c.width, height: c.height,
  }));
  const q = new URLSearchParams({ from: new Date(report.period.fromMs).toISOString(), to: new Date(report.period.toMs).toISOString() });
  const api = `/api/v1/assets/${assetId}`;
  const shownFrom = day(new Date(report.period.fromMs));
  const shownTo = day(new Date(report.period.toMs - 1));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3 print:hidden">
        <form method="get" className="flex flex-wrap items-end gap-2" data-testid="report-period">
          <label className="text-xs text-muted">
            First day (UTC)
            <input type="date" name="from" defaultValue={shownFrom} className={`${inputClass} mt-0.5 block`} />
          </label>
          <label className="text-xs text-muted">
            Last day (UTC)
            <input type="date" name="to" defaultValue={shownTo} className={`${inputClass} mt-0.5 block`} />
          </label>
          <button type="submit" className={buttonClass("secondary")}>Show</button>
        </form>
        <div className="flex flex-wrap items-center gap-2">
          <a href={`${api}/report?${q.toString()}`} className={buttonClass("primary")} data-testid="report-download">Download PDF</a>
          <PrintButton />
          <a href={`${api}/export/modal-history.csv?${q.toString()}`} className={buttonClass("quiet")}>Modal history (CSV)</a>
          <a href={`${api}/export/data-dictionary`} className={buttonClass("quiet")}>Data dictionary</a>
        </div>
      </div>
      {error ? <Notice tone="error" className="print:hidden">{error} Showing the last 30 days.</Notice> : null}
      <header>
        <div className="text-xs text-muted">{report.organisationName} · asset report</div>
        <h2 className="text-lg font-semibold">{report.asset.name}: {shownFrom} to {shownTo} (UTC)</h2>
        <div className="text-xs text-muted">
          Generated {new Date(report.generatedAtMs).toISOString().slice(0, 16).replace("T", " ")} UTC ·{" "}
          <Link href={`/assets/${assetId}`} className="text-accent hover:underline print:hidden">Back to the asset</Link>
        </div>
      </header>
      <ReportView report={report} charts={charts} />
    </div>
  );
}
