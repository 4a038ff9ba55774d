import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/http/errors";
import { dataFormatOf, decodeSamples, MIN_SAMPLES } from "@/lib/services/ingest/decode";

const enc = (s: string) => new TextEncoder().encode(s);
const rows = (n: number, f: (k: number) => string) => Array.from({ length: n }, (_, k) => f(k)).join("\n");

describe("decodeSamples (upload contract data formats)", () => {
  it("reads CSV with CRLF line ends, a UTF-8 BOM and one trailing blank line", () => {
    const text = `\uFEFFA,B\r\n${rows(MIN_SAMPLES, (k) => `${k},${-k / 4}`).replaceAll("\n", "\r\n")}\r\n`;
    const d = decodeSamples(enc(text), "csv", ["A", "B"]);
    expect(d.sampleCount).toBe(MIN_SAMPLES);
    expect(d.data[0][MIN_SAMPLES - 1]).toBe(MIN_SAMPLES - 1);
    expect(d.data[1][3]).toBe(-0.75);
  });

  it("reads float32 little-endian interleaved sample by sample (IEEE 754 binary32 round trip)", () => {
    const n = MIN_SAMPLES;
    const view = new DataView(new ArrayBuffer(4 * 2 * n));
    for (let k = 0; k < n; k++) {
      view.setFloat32(8 * k, k * 0.1, true);
      view.setFloat32(8 * k + 4, -k, true);
    }
    const d = decodeSamples(new Uint8Array(view.buffer), "f32le", ["A", "B"]);
    // Math.fround gives the binary32 value the gateway wrote.
    expect(d.data[0][7]).toBe(Math.fround(0.7));
    expect(d.data[1][n - 1]).toBe(-(n - 1));
  });

  it("refuses empty cells, 'Infinity' and a blank line inside the data as 422", () => {
    const base = rows(MIN_SAMPLES, (k) => `${k},${k}`).split("\n");
    for (const [i, bad] of [[3, "1,"], [4, "Infinity,1"], [5, ""]] as const) {
      const lines = [...base];
      lines[i] = bad;
      expect(() => decodeSamples(enc(`A,B\n${lines.join("\n")}\n`), "csv", ["A", "B"])).toThrow(AppError);
    }
  });

  it("maps part types to formats and refuses others with 415", () => {
    expect(dataFormatOf("text/csv; charset=utf-8")).toBe("csv");
    expect(dataFormatOf("application/octet-stream")).toBe("f32le");
    expect(() => dataFormatOf("application/gzip")).toThrow(expect.objectContaining({ code: "unsupported_media_type", status: 415 }));
    expect(() => dataFormatOf("application/gzip")).toThrow(AppError);
  });
});
