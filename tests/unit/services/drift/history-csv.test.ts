/**
 * The modal history CSV parser (issue 5 §1): header, ISO 8601 UTC times, optional damping
 * and temperature, every bad row named by its line (1 = header), nothing returned on error.
 */
import { describe, expect, it } from "vitest";
import { parseHistoryCsv } from "@/lib/services/drift/history-csv";

const HEADER = "timestamp,mode,frequencyHz,dampingRatio,temperatureC";

describe("parseHistoryCsv", () => {
  it("reads rows with empty optional fields, a BOM and CRLF line ends", () => {
    const { rows, errors } = parseHistoryCsv(`\uFEFF${HEADER}\r\n2025-03-01T12:00:00Z,V1,2.5,,\r\n2025-03-01T12:00:00.250+00:00,L1,3.25,0.015,-4.5\r\n`);
    expect(errors).toEqual([]);
    expect(rows).toEqual([
      { line: 2, at: new Date(Date.UTC(2025, 2, 1, 12)), mode: "V1", frequencyHz: 2.5, dampingRatio: null, temperatureC: null },
      { line: 3, at: new Date(Date.UTC(2025, 2, 1, 12, 0, 0, 250)), mode: "L1", frequencyHz: 3.25, dampingRatio: 0.015, temperatureC: -4.5 },
    ]);
  });

  it("refuses a wrong header on line 1", () => {
    expect(parseHistoryCsv("time,mode,f\n2025-03-01T12:00:00Z,V1,2.5").errors).toEqual([{ line: 1, reason: expect.stringContaining(HEADER) }]);
  });

  it("names every bad row and returns no rows", () => {
    const text = [
      HEADER,
      "2025-03-01 12:00,V1,2.5,,", // not ISO 8601 with a zone
      "2025-03-01T12:00:00-05:00,V1,2.5,,", // not UTC
      "2025-03-01T13:00:00Z,,2.5,,", // no mode
      "2025-03-01T14:00:00Z,V1,0,,", // frequency must be > 0
      "2025-03-01T15:00:00Z,V1,2.5,2,", // damping ratio is a fraction, not a percent
      "2025-03-01T16:00:00Z,V1,2.5,,hot", // temperature not a number
      "2025-03-01T17:00:00Z,V1,2.5,,",
      "2025-03-01T17:00:00Z,V1,2.6,,", // same mode and time as line 8
      "2025-03-01T18:00:00Z,V1,2.5,,,", // six fields
    ].join("\n");
    const { rows, errors } = parseHistoryCsv(text);
    expect(rows).toEqual([]);
    expect(errors.map((e) => e.line)).toEqual([2, 3, 4, 5, 6, 7, 9, 10]);
    expect(errors.find((e) => e.line === 9)?.reason).toMatch(/repeats line 8/);
  });

  it("refuses a file without data rows", () => {
    expect(parseHistoryCsv(`${HEADER}\n\n`).errors).toEqual([{ line: 1, reason: "the file has no data rows" }]);
  });
});
