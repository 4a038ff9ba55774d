import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/http/errors";
import { BufferPool } from "@/lib/services/ingest/buffer-pool";
import { dataFormatOf, decodeSamples, inflateIfGzip, MIN_SAMPLES } from "@/lib/services/ingest/decode";

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

describe("inflateIfGzip (into pooled memory)", () => {
  const pool = () => new BufferPool(64 * 1024 * 1024);
  const bytesOf = (n: number) => Buffer.from(Array.from({ length: n }, (_, i) => (i * 7919) % 251));

  it("inflates every member of a multi-member file [RFC 1952 §2.2] into one pooled buffer, handed back on release", async () => {
    const plain = bytesOf(3 * 1024 * 1024 + 17);
    const members = Buffer.concat([gzipSync(plain.subarray(0, 1000)), gzipSync(plain.subarray(1000))]);
    const p = pool();
    const out = await inflateIfGzip(members, "f32le", 16 * 1024 * 1024, p);
    expect(out.bytes.equals(plain)).toBe(true);
    expect(out.bytes.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(p.keptBytes).toBe(0);
    out.release();
    expect(p.keptBytes).toBeGreaterThanOrEqual(plain.length);
  });

  it("returns data without a gzip header as the same view, and refuses output past the limit with 413", async () => {
    const raw = bytesOf(4096);
    const same = await inflateIfGzip(raw, "f32le", 1024, pool());
    expect(same.bytes).toBe(raw);
    const p = pool();
    const err = await inflateIfGzip(gzipSync(Buffer.alloc(5 * 1024 * 1024)), "f32le", 2 * 1024 * 1024, p).catch((e: unknown) => e);
    expect((err as AppError).status).toBe(413);
    expect((err as AppError).details).toMatchObject({ rule: "max_decoded_bytes", limitBytes: 2 * 1024 * 1024 });
    // The partly filled buffer went back to the pool.
    expect(p.keptBytes).toBeGreaterThan(0);
  });

  it("takes float32 bytes that only look like gzip as raw samples, and refuses such CSV with 400", async () => {
    const fake = Buffer.concat([Buffer.from([0x1f, 0x8b, 0x08]), bytesOf(61)]);
    expect((await inflateIfGzip(fake, "f32le", 1 << 20, pool())).bytes).toBe(fake);
    const err = await inflateIfGzip(fake, "csv", 1 << 20, pool()).catch((e: unknown) => e);
    expect((err as AppError).details).toMatchObject({ rule: "gzip" });
  });
});
