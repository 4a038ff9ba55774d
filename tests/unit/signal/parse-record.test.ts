import { describe, expect, it } from "vitest";
import { isGzip, parseCsvRecord, parseFloat32Record, parseRecordMeta } from "@/lib/signal/parse-record";

const meta = { recordId: "gw1-000123", startedAt: "2025-03-01T12:00:00Z", sampleRateHz: 100, channels: ["N1-Z", "N2-Z"], units: "mg", temperatureC: 4.5 };

describe("parseRecordMeta (upload contract, PRODUCT.md)", () => {
  it("accepts the contract's fields", () => {
    expect(parseRecordMeta({ ...meta, environment: { windSpeedMps: 3, humidityPct: 80 } })).toEqual({ ...meta, environment: { windSpeedMps: 3, humidityPct: 80 } });
  });
  it("refuses missing or invalid fields naming them", () => {
    expect(() => parseRecordMeta({ ...meta, recordId: "" })).toThrow(/recordId/);
    expect(() => parseRecordMeta({ ...meta, startedAt: "yesterday" })).toThrow(/startedAt/);
    expect(() => parseRecordMeta({ ...meta, startedAt: "2025-03-01T12:00:00+02:00" })).toThrow(/UTC/);
    expect(() => parseRecordMeta({ ...meta, sampleRateHz: 0 })).toThrow(/sampleRateHz must be within \(0, 100000\] \(got 0\)/);
    expect(() => parseRecordMeta({ ...meta, channels: ["A", "A"] })).toThrow(/distinct/);
    expect(() => parseRecordMeta({ ...meta, units: "ft/s2" })).toThrow(/units must be one of/);
    expect(() => parseRecordMeta({ ...meta, temperatureC: "cold" })).toThrow(TypeError);
    expect(() => parseRecordMeta([])).toThrow(TypeError);
  });
});

describe("parseCsvRecord", () => {
  it("reads columns in header order", () => {
    const [a, b] = parseCsvRecord("N1-Z,N2-Z\r\n1,2\n3.5,-4e-3\n\n", meta.channels);
    expect(Array.from(a)).toEqual([1, 3.5]);
    expect(Array.from(b)).toEqual([2, -0.004]);
  });
  it("refuses a header mismatch, ragged rows and non-finite cells with their position", () => {
    expect(() => parseCsvRecord("N2-Z,N1-Z\n1,2\n", meta.channels)).toThrow(/header/);
    expect(() => parseCsvRecord("N1-Z,N2-Z\n1,2\n3\n", meta.channels)).toThrow(/row 3 must have 2 values \(got 1\)/);
    expect(() => parseCsvRecord("N1-Z,N2-Z\n1,NaN\n", meta.channels)).toThrow(/row 2, column N2-Z/);
    expect(() => parseCsvRecord("N1-Z,N2-Z\n", meta.channels)).toThrow(RangeError);
  });
});

describe("parseFloat32Record", () => {
  it("de-interleaves little-endian float32 samples", () => {
    const f = new Float32Array([1, 2, 3, 4, 5, 6]);
    const [a, b] = parseFloat32Record(new Uint8Array(f.buffer), 2);
    expect(Array.from(a)).toEqual([1, 3, 5]);
    expect(Array.from(b)).toEqual([2, 4, 6]);
  });
  it("refuses a byte count that is not whole frames and non-finite samples", () => {
    expect(() => parseFloat32Record(new Uint8Array(12), 2)).toThrow(/multiple of 4·channels = 8 bytes \(got 12\)/);
    expect(() => parseFloat32Record(new Uint8Array(new Float32Array([1, Number.NaN]).buffer), 2)).toThrow(TypeError);
  });
  it("recognises the gzip magic number (RFC 1952)", () => {
    expect(isGzip(new Uint8Array([0x1f, 0x8b, 8]))).toBe(true);
    expect(isGzip(new Uint8Array([0x4e, 0x31]))).toBe(false);
  });
});
