import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { AppError } from "@/lib/http/errors";
import { checkAndHashSamples, MIN_SAMPLES } from "@/lib/services/ingest/decode";
import { closeDigestHelper, digestUpload, firstNonFiniteF32 } from "@/lib/services/ingest/digest-thread";

afterAll(() => closeDigestHelper());

/** Bytes in shared memory (as the upload pool lends them), so the helper thread digests them. */
function shared(bytes: Uint8Array, offset = 0): Buffer {
  const b = Buffer.from(new SharedArrayBuffer(offset + bytes.length)).subarray(offset);
  b.set(bytes);
  return b;
}

function floats(values: number[]): Uint8Array {
  return new Uint8Array(new Float32Array(values).buffer);
}

describe("digestUpload (SHA-256 and the float32 scan off the request thread)", () => {
  it("gives the FIPS 180-2 SHA-256 of 'abc' from shared and from ordinary memory", async () => {
    // FIPS 180-2, Appendix B.1 (one-block message "abc").
    const abc = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
    expect(await digestUpload(shared(Buffer.from("abc")), 0)).toEqual({ sha256: abc, firstNonFinite: -1, thread: "helper" });
    expect(await digestUpload(Buffer.from("abc"), 0)).toEqual({ sha256: abc, firstNonFinite: -1, thread: "caller" });
  });

  it("finds the first ±Infinity or NaN at the same index as a plain scan, or none", async () => {
    const n = 50_000;
    const values = Array.from({ length: n }, (_, i) => Math.sin(i) * 1e3);
    const cases: Array<[number, number]> = [[-1, 0], [0, Number.NaN], [n - 1, Infinity], [31_337, -Infinity]];
    for (const [at, bad] of cases) {
      const v = [...values];
      if (at >= 0) v[at] = bad;
      // A second non-finite value later must not win over the first.
      if (at >= 0 && at < n - 1) v[n - 1] = Number.NaN;
      const bytes = floats(v);
      const fromHelper = await digestUpload(shared(bytes), n);
      expect(fromHelper.thread).toBe("helper");
      expect(fromHelper.firstNonFinite).toBe(at);
      expect(firstNonFiniteF32(bytes, n)).toBe(at);
      expect(fromHelper.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    }
  });

  it("keeps answers apart when many digests are in flight at once", async () => {
    const inputs = Array.from({ length: 12 }, (_, k) => shared(floats(Array.from({ length: 4096 }, (_, i) => (i === k * 100 ? Number.NaN : i + k)))));
    const out = await Promise.all(inputs.map((b) => digestUpload(b, 4096)));
    out.forEach((d, k) => {
      expect(d.firstNonFinite).toBe(k * 100);
      expect(d.sha256).toBe(createHash("sha256").update(inputs[k]).digest("hex"));
    });
  });

  it("digests a view at an offset into shared memory, and works again after the helper is closed", async () => {
    const bytes = floats([1, 2, Number.NaN, 4]);
    const d1 = await digestUpload(shared(bytes, 8), 4);
    await closeDigestHelper();
    const d2 = await digestUpload(shared(bytes, 16), 4);
    expect(d1).toEqual({ sha256: createHash("sha256").update(bytes).digest("hex"), firstNonFinite: 2, thread: "helper" });
    expect(d2).toEqual(d1);
  });
});

describe("checkAndHashSamples (the upload's content check)", () => {
  it("names the sample and channel of a non-finite value, counts samples and hashes the bytes", async () => {
    const nch = 3;
    const good = Array.from({ length: MIN_SAMPLES * nch }, (_, i) => i / 7);
    const ok = await checkAndHashSamples(shared(floats(good)), "f32le", ["A", "B", "C"]);
    expect(ok).toEqual({ sampleCount: MIN_SAMPLES, sha256: createHash("sha256").update(floats(good)).digest("hex") });

    const bad = [...good];
    bad[5 * nch + 2] = Infinity;
    const err = await checkAndHashSamples(shared(floats(bad)), "f32le", ["A", "B", "C"]).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).details).toMatchObject({ rule: "non_finite", sample: 6, channelIndex: 2 });
  });

  it("refuses ragged float32 data and too few samples with their rules", async () => {
    const ragged = await checkAndHashSamples(shared(new Uint8Array(4 * 3 * 10 + 4)), "f32le", ["A", "B", "C"]).catch((e: unknown) => e);
    expect((ragged as AppError).details).toMatchObject({ rule: "ragged_rows" });
    const short = await checkAndHashSamples(shared(floats(Array.from({ length: 2 * (MIN_SAMPLES - 1) }, () => 1))), "f32le", ["A", "B"]).catch((e: unknown) => e);
    expect((short as AppError).details).toMatchObject({ rule: "too_short", samples: MIN_SAMPLES - 1 });
  });
});
