/**
 * The asset report as a PDF (pdfkit, standard fonts, no network): first the owners' summary
 * in plain language (condition, what was found, what was done) with the caution, then the
 * engineering annex (modal table, baseline and its fit, alerts with outcomes, data
 * availability, trend images per tracked mode) and the caution again at the end.
 */
import { bullets, contentWidth, ensureSpace, heading, INK, MUTED, newPdf, noteBox, paragraph, pdfBytes, table, winAnsi, type Pdf } from "./pdf-kit";
import type { ReportChart } from "./report-charts";
import type { AssetReport } from "./report-data";
import { ALERT_COLUMNS, alertRows, availabilityRows, baselineLine, FIT_COLUMNS, fitRows, MODAL_COLUMNS, modalRows } from "./report-tables";
import { formatDay, summariseReport } from "./summary";

export const CONDITION_COLOURS: Record<AssetReport["asset"]["condition"], string> = {
  steady: "#0f766e", watch: "#b45309", alert: "#b91c1c", silent: "#64748b", commissioning: "#4f46e5",
};

function titleBlock(doc: Pdf, r: AssetReport): void {
  doc.font("Helvetica").fontSize(9).fillColor(MUTED).text(winAnsi(`${r.organisationName} · Modewarden asset report`));
  doc.moveDown(0.2).font("Helvetica-Bold").fontSize(20).fillColor(INK).text(winAnsi(r.asset.name));
  const dims = r.asset.mainDimensionM !== null ? `, ${r.asset.mainDimensionM} m` : "";
  doc.font("Helvetica").fontSize(10).fillColor(MUTED)
    .text(winAnsi(`${r.asset.kind}${r.asset.material ? `, ${r.asset.material}` : ""}${dims}`))
    .text(`Period ${formatDay(r.period.fromMs)} to ${formatDay(r.period.toMs - 1)} (UTC) · generated ${new Date(r.generatedAtMs).toISOString().slice(0, 16).replace("T", " ")} UTC`);
  doc.moveDown(0.8);
}

function conditionBadge(doc: Pdf, r: AssetReport, word: string): void {
  const x = doc.page.margins.left;
  const y = doc.y;
  const colour = CONDITION_COLOURS[r.asset.condition];
  doc.font("Helvetica-Bold").fontSize(11);
  const w = doc.widthOfString(word) + 20;
  if (r.asset.condition === "commissioning") doc.save().lineWidth(1.5).rect(x, y, w, 20).stroke(colour).restore();
  else doc.save().rect(x, y, w, 20).fill(colour).restore();
  doc.fillColor(r.asset.condition === "commissioning" ? colour : "#ffffff").text(word, x + 10, y + 5, { lineBreak: false });
  doc.x = x;
  doc.y = y + 28;
}

function summaryPart(doc: Pdf, r: AssetReport): void {
  const s = summariseReport(r);
  heading(doc, "Summary for the owner");
  conditionBadge(doc, r, s.conditionWord);
  paragraph(doc, s.condition);
  heading(doc, "What was found", 12);
  bullets(doc, s.found);
  heading(doc, "What was done", 12);
  bullets(doc, s.done);
  doc.moveDown(0.4);
  noteBox(doc, "Caution.", r.caution);
  paragraph(doc, `Open the asset in Modewarden: ${r.link}`, { size: 8.5, colour: MUTED });
}

function chartsPart(doc: Pdf, charts: ReportChart[]): void {
  // Keep the heading with the first chart.
  ensureSpace(doc, charts.length ? (contentWidth(doc) * charts[0].height) / charts[0].width + 90 : 60);
  heading(doc, "Trends", 12);
  if (charts.length === 0) paragraph(doc, "No identified frequencies in this period: nothing to draw.", { colour: MUTED });
  const w = contentWidth(doc);
  for (const c of charts) {
    const h = (w * c.height) / c.width;
    ensureSpace(doc, h + 48);
    doc.font("Helvetica-Bold").fontSize(9.5).fillColor(INK).text(winAnsi(c.title), doc.page.margins.left, doc.y);
    doc.moveDown(0.2);
    const y = doc.y;
    doc.image(c.png, doc.page.margins.left, y, { width: w, height: h });
    doc.y = y + h + 3;
    paragraph(doc, c.caption, { size: 8, colour: MUTED });
  }
}

function annex(doc: Pdf, r: AssetReport, charts: ReportChart[]): void {
  doc.addPage();
  heading(doc, "Engineering annex", 16);
  heading(doc, "Tracked modes", 12);
  if (r.modes.length === 0) paragraph(doc, "No tracked modes.", { colour: MUTED });
  else table(doc, MODAL_COLUMNS.map((t, i) => ({ title: t, width: [70, 50, 50, 50, 55, 70, 58, 80][i], align: i === 0 ? "left" as const : "right" as const })), modalRows(r));
  paragraph(doc, "Identified: accepted records or imported rows of the period in which the mode was found. Sustained change: the last daily EWMA of the residual "
    + "after temperature compensation, as % of the nominal frequency. Smallest detectable change: the smallest sustained frequency shift the EWMA "
    + "chart confirms with an in-control average run length of about 500 days (Lucas & Saccucci, 1990).", { size: 8, colour: MUTED });
  heading(doc, "Baseline", 12);
  paragraph(doc, baselineLine(r));
  const fits = fitRows(r);
  if (fits.length) table(doc, FIT_COLUMNS.map((t, i) => ({ title: t, width: [80, 60, 85, 75, 70, 113][i], align: i < 2 ? "left" as const : "right" as const })), fits);
  if (r.driftSkipped) paragraph(doc, `Drift statistics: ${r.driftSkipped}.`, { colour: MUTED });
  heading(doc, "Alerts and outcomes", 12);
  if (r.alerts.length === 0) paragraph(doc, "No alert was raised, open or closed in this period.", { colour: MUTED });
  else table(doc, ALERT_COLUMNS.map((t, i) => ({ title: t, width: [58, 80, 60, 80, 90, 115][i] })), alertRows(r));
  heading(doc, "Data availability", 12);
  table(doc, [{ title: "Measure", width: 300 }, { title: "Value", width: 183, align: "right" }], availabilityRows(r));
  chartsPart(doc, charts);
  heading(doc, "Caution", 12);
  noteBox(doc, "Caution.", r.caution);
}

function footer(doc: Pdf, r: AssetReport): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font("Helvetica").fontSize(7.5).fillColor(MUTED)
      .text(winAnsi(`${r.asset.name} · ${formatDay(r.period.fromMs)} to ${formatDay(r.period.toMs - 1)} · page ${i + 1} of ${range.count}`),
        doc.page.margins.left, doc.page.height - 36, { width: contentWidth(doc), align: "center", lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

/** The report's PDF bytes (see the file header). */
export async function renderReportPdf(r: AssetReport, charts: ReportChart[]): Promise<Buffer> {
  const doc = newPdf(`${r.asset.name}: asset report ${formatDay(r.period.fromMs)} to ${formatDay(r.period.toMs - 1)}`, r.organisationName);
  titleBlock(doc, r);
  summaryPart(doc, r);
  annex(doc, r, charts);
  footer(doc, r);
  return pdfBytes(doc);
}
