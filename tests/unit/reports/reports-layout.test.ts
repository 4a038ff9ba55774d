/**
 * Report layout without I/O: the owners' summary (PRODUCT.md conditions, alert states and
 * outcomes in plain words), the trend images and the PDF container (ISO 32000-1: a file
 * starts with "%PDF-" and each embedded raster is an XObject with /Subtype /Image).
 */
import { describe, expect, it } from "vitest";
import { REPORT_CAUTION } from "@/lib/reports/caution";
import { renderReportCharts } from "@/lib/reports/report-charts";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import { winAnsi } from "@/lib/reports/pdf-kit";
import { describeAlert, summariseReport } from "@/lib/reports/summary";
import { fixtureReport } from "./fixture-report";

describe("summariseReport", () => {
  it("names the condition, the mode that moved beyond the detectable change and the open alert", () => {
    const s = summariseReport(fixtureReport());
    expect(s.conditionWord).toBe("Alert");
    expect(s.found.join(" ")).toMatch(/V1 has vibrated 2\.00 % below its expected frequency/);
    expect(s.done).toHaveLength(1);
    expect(s.done[0]).toMatch(/^Alert raised on \d{4}-\d{2}-\d{2} \(V1\): open, not yet acknowledged\.$/);
  });

  it("says no mode moved when every residual is inside the smallest detectable change", () => {
    const r = fixtureReport();
    r.asset.condition = "steady";
    r.modes[0].sustainedChangePct = 0.1; // below the 0.25 % minimal shift of the fixture
    r.alerts = [];
    const s = summariseReport(r);
    expect(s.found).toContain("No tracked mode moved by more than the smallest change the monitoring can confirm.");
    expect(s.done[0]).toMatch(/no alert was open/);
  });

  it("gives a closed alert's date, outcome and findings", () => {
    const a = { ...fixtureReport().alerts[0], state: "closed" as const, outcome: "defect_found" as const, closedAtMs: Date.UTC(2026, 10, 3), findings: "Cracked gusset plate." };
    expect(describeAlert(a)).toContain("closed on 2026-11-03, a defect was found. Findings: Cracked gusset plate.");
  });
});

describe("renderReportPdf", () => {
  it("embeds one PNG per trend chart and writes a PDF", async () => {
    const r = fixtureReport();
    const charts = renderReportCharts(r);
    expect(charts.map((c) => c.kind)).toEqual(["frequency", "residual"]);
    const pdf = await renderReportPdf(r, charts);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pdf.toString("latin1").match(/\/Subtype \/Image/g)).toHaveLength(charts.length);
  });

  it("keeps the caution in the standard fonts' character set unchanged", () => {
    expect(winAnsi(REPORT_CAUTION)).toBe(REPORT_CAUTION);
    expect(winAnsi("−0.5 Hz, σ ≥ 2")).toBe("-0.5 Hz, sigma >= 2");
  });
});
