/**
 * The upload route's multipart parser, checked against bodies written by an independent
 * encoder: the FormData serialisation of Node's fetch implementation (undici, WHATWG Fetch
 * "multipart/form-data encoding algorithm"), fed in every possible two-way split and in
 * random three-way splits; and against hand-written bodies for the RFC 2046 §5.1.1 grammar
 * (preamble, transport padding, a part without headers, epilogue).
 */
import { describe, expect, it } from "vitest";
import { boundaryOf, MAX_PART_HEADER_BYTES, MultipartParser, MultipartSyntaxError, type PartHeaders } from "@/lib/services/ingest/multipart-parser";

interface Parsed { headers: PartHeaders; body: Buffer }

function parse(boundary: string, pieces: Buffer[]): Parsed[] {
  const parts: Parsed[] = [];
  let current: Buffer[] = [];
  const parser = new MultipartParser(boundary, {
    onPart: (headers) => {
      current = [];
      parts.push({ headers, body: Buffer.alloc(0) });
      return (b) => current.push(Buffer.from(b));
    },
    onPartEnd: () => {
      parts[parts.length - 1].body = Buffer.concat(current);
    },
  });
  for (const p of pieces) parser.write(p);
  parser.end();
  return parts;
}

async function formDataBody(fd: FormData): Promise<{ body: Buffer; boundary: string }> {
  const res = new Response(fd);
  const boundary = boundaryOf(res.headers.get("content-type") ?? "");
  if (!boundary) throw new Error("no boundary from the encoder");
  return { body: Buffer.from(await res.arrayBuffer()), boundary };
}

/** Deterministic bytes (LCG, Numerical Recipes constants) with CR LF and '-' sprinkled in to tempt the delimiter search. */
function trickyBytes(n: number, seed: number): Buffer {
  const b = Buffer.alloc(n);
  let s = seed >>> 0;
  for (let i = 0; i < n; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    const r = s >>> 24;
    b[i] = r < 40 ? 0x0d : r < 80 ? 0x0a : r < 120 ? 0x2d : r;
  }
  return b;
}

describe("MultipartParser on FormData bodies from undici", () => {
  it("reads both parts the same at every two-way split of the body", async () => {
    const fd = new FormData();
    const meta = JSON.stringify({ recordId: "r-1", note: "naïve — ünïcode" });
    const data = trickyBytes(300, 1);
    fd.append("meta", meta);
    fd.append("data", new Blob([new Uint8Array(data)], { type: "application/octet-stream" }), "r.f32");
    const { body, boundary } = await formDataBody(fd);
    for (let cut = 0; cut <= body.length; cut++) {
      const parts = parse(boundary, [body.subarray(0, cut), body.subarray(cut)]);
      expect(parts.map((p) => p.headers.name)).toEqual(["meta", "data"]);
      expect(parts[0].body.toString("utf8")).toBe(meta);
      expect(parts[0].headers).toMatchObject({ filename: null, contentType: null });
      expect(parts[1].headers).toMatchObject({ filename: "r.f32", contentType: "application/octet-stream" });
      expect(parts[1].body.equals(data)).toBe(true);
    }
  });

  it("reads data holding near-misses of the delimiter in random three-way splits", async () => {
    const fd = new FormData();
    fd.append("meta", "{}");
    const probe = await formDataBody(fd);
    // Data with the delimiter minus its last character, many times over.
    const nearMiss = Buffer.from(`\r\n--${probe.boundary.slice(0, -1)}`);
    const data = Buffer.concat([trickyBytes(5000, 7), nearMiss, trickyBytes(100, 8), nearMiss, nearMiss]);
    const fd2 = new FormData();
    fd2.append("meta", "{}");
    fd2.append("data", new Blob([new Uint8Array(data)]), "x.bin");
    const { body, boundary } = await formDataBody(fd2);
    let s = 12345;
    const rnd = (n: number) => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) % n);
    for (let trial = 0; trial < 300; trial++) {
      const a = rnd(body.length + 1);
      const b = a + rnd(body.length - a + 1);
      const parts = parse(boundary, [body.subarray(0, a), body.subarray(a, b), body.subarray(b)]);
      expect(parts[1].body.equals(data)).toBe(true);
    }
  });
});

describe("MultipartParser on the RFC 2046 grammar", () => {
  const crlf = (lines: string[]) => Buffer.from(lines.join("\r\n"), "latin1");

  it("skips a preamble and an epilogue, allows transport padding and a part with no headers", () => {
    const body = crlf([
      "This is the preamble; it is ignored.",
      "--XyZ \t",
      'Content-Disposition: form-data; name="meta"',
      "",
      "{}",
      "--XyZ",
      "",
      "no headers here",
      "--XyZ--",
      "and an epilogue",
    ]);
    const parts = parse("XyZ", [body]);
    expect(parts.map((p) => [p.headers.name, p.body.toString()])).toEqual([["meta", "{}"], [null, "no headers here"]]);
  });

  it("reads quoted parameters with escapes and header names in any case", () => {
    const body = crlf(["--b", 'CONTENT-disposition: form-data; filename="a \\"q\\".csv"; name=data', "content-TYPE: text/csv", "", "x,y", "--b--"]);
    const [p] = parse("b", [body]);
    expect(p.headers).toEqual({ name: "data", filename: 'a "q".csv', contentType: "text/csv" });
  });

  it("refuses a body without its close delimiter, text after a boundary, a header line without a name, headers that never end", () => {
    expect(() => parse("b", [crlf(["--b", 'Content-Disposition: form-data; name="meta"', "", "{}"])])).toThrow(MultipartSyntaxError);
    expect(() => parse("b", [crlf(["--bX", "", "", "--b--"])])).toThrow(MultipartSyntaxError);
    expect(() => parse("b", [crlf(["--b", "no colon", "", "x", "--b--"])])).toThrow(MultipartSyntaxError);
    const long = Buffer.concat([crlf(["--b", "X-Pad: "]), Buffer.alloc(MAX_PART_HEADER_BYTES + 10, 0x61)]);
    expect(() => parse("b", [long])).toThrow(/too long/);
  });

  it("takes the boundary from a quoted or plain parameter and reports a missing one", () => {
    expect(boundaryOf('multipart/form-data; boundary="a b:c"')).toBe("a b:c");
    expect(boundaryOf("multipart/form-data; charset=utf-8; BOUNDARY=----x1")).toBe("----x1");
    expect(boundaryOf("multipart/form-data")).toBeNull();
  });
});
