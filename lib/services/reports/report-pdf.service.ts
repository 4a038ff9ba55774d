/**
 * The asset report as a PDF (kept apart from report.service.ts so pages that only show the
 * report do not load pdfkit).
 */
import type { Actor } from "@/lib/domain/types";
import { renderReportCharts, type ReportChart } from "@/lib/reports/report-charts";
import type { AssetReport } from "@/lib/reports/report-data";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import { getAssetReport, type ReportPeriod } from "./report.service";

export interface RenderedReport { report: AssetReport; charts: ReportChart[]; pdf: Buffer; filename: string }

/** The report and its PDF; the file name carries the asset and the period. */
export async function renderAssetReport(actor: Actor, assetId: string, period: ReportPeriod, opts: { nowMs?: number } = {}): Promise<RenderedReport> {
  const report = await getAssetReport(actor, assetId, period, opts);
  const charts = renderReportCharts(report);
  const pdf = await renderReportPdf(report, charts);
  return { report, charts, pdf, filename: reportFilename(report) };
}

/** "heron-reach-footbridge-2026-10-01-2026-10-31.pdf" (ASCII, safe in a header). */
export function reportFilename(r: AssetReport, ext = "pdf"): string {
  const slug = r.asset.name.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase() || "asset";
  const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  return `${slug}-${day(r.period.fromMs)}-${day(r.period.toMs - 1)}.${ext}`;
}
