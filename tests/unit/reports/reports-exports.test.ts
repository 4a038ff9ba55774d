/**
 * Pure parts of the report exports and mail: the modal-history CSV (RFC 4180 quoting, one
 * column per dictionary entry), the data dictionary, and the monthly report e-mail (summary,
 * link, the caution PRODUCT.md asks for, HTML escaping).
 */
import { describe, expect, it } from "vitest";
import { monthlyReportEmail } from "@/lib/email/templates/monthly-report";
import { REPORT_CAUTION } from "@/lib/reports/caution";
import { dataDictionary, MODAL_HISTORY_DICTIONARY, modalHistoryCsv } from "@/lib/reports/modal-history-csv";

describe("modalHistoryCsv", () => {
  const rows = [
    { atMs: Date.UTC(2026, 9, 1, 6), label: 'Vertical "1", main', trackedModeId: "m1", frequencyHz: 2.5, dampingRatio: 0.012, temperatureC: 8.5, predictedHz: 2.45, residualHz: 0.05, outOfEnvelope: false },
    { atMs: Date.UTC(2026, 9, 1, 12), label: "Lateral 1", trackedModeId: "m2", frequencyHz: 3.1, dampingRatio: null, temperatureC: null, predictedHz: null, residualHz: null, outOfEnvelope: true },
  ];
  const lines = modalHistoryCsv(rows).split("\r\n");

  it("writes the dictionary's columns in order and quotes labels per RFC 4180 §2.6–2.7", () => {
    expect(lines[0]).toBe(MODAL_HISTORY_DICTIONARY.map((d) => d.column).join(","));
    expect(lines[1].startsWith('2026-10-01T06:00:00.000Z,"Vertical ""1"", main",m1,2.5,0.012,8.5,2.45,0.05,')).toBe(true);
    expect(lines[lines.length - 1]).toBe(""); // CRLF after the last record (RFC 4180 §2.2 allows it)
  });

  it("gives residual_pct = 100·residual/predicted and leaves missing values empty", () => {
    const cells = lines[1].split(/,(?=(?:[^"]*"[^"]*")*[^"]*$)/);
    expect(Number(cells[8])).toBeCloseTo((100 * 0.05) / 2.45, 12);
    expect(lines[2]).toBe("2026-10-01T12:00:00.000Z,Lateral 1,m2,3.1,,,,,,true");
  });

  it("documents every column with a unit or type in Markdown and in CSV", () => {
    const md = dataDictionary("md");
    for (const d of MODAL_HISTORY_DICTIONARY) expect(md).toContain(`| ${d.column} | ${d.type} |`);
    expect(dataDictionary("csv").trimEnd().split("\r\n")).toHaveLength(MODAL_HISTORY_DICTIONARY.length + 1);
  });
});

describe("monthlyReportEmail", () => {
  const link = "http://127.0.0.1:3000/assets/00000000-0000-4000-8000-000000000001";
  const mail = monthlyReportEmail({
    organisationName: "Larkspur County Structures Office", assetName: "Heron <Reach> & Footbridge", month: "2026-10",
    conditionWord: "Alert", condition: "A persistent change has been confirmed.", found: ["V1 moved."], done: ["Alert raised on 2026-10-27: open."],
    link, attachmentName: "heron-reach-2026-10-01-2026-10-31.pdf",
  });

  it("names the month and asset, lists what was found and done, links the asset and names the attachment", () => {
    expect(mail.subject).toBe("Monthly report 2026-10: Heron <Reach> & Footbridge");
    expect(mail.text).toContain("- V1 moved.");
    expect(mail.text).toContain("- Alert raised on 2026-10-27: open.");
    expect(mail.text).toContain(link);
    expect(mail.text).toContain("heron-reach-2026-10-01-2026-10-31.pdf");
    expect(mail.html).toContain(`href="${link}"`);
  });

  it("carries the caution with the points PRODUCT.md asks for, and escapes HTML", () => {
    expect(mail.text).toContain(REPORT_CAUTION);
    for (const phrase of [/not an engineering assessment/, /temperature, moisture, traffic and faulty sensors/, /licensed structural engineer/, /local codes/, /emergency procedures first/]) {
      expect(REPORT_CAUTION).toMatch(phrase);
    }
    expect(mail.html).toContain("Heron &lt;Reach&gt; &amp; Footbridge");
    expect(mail.html).not.toContain("<Reach>");
  });
});
