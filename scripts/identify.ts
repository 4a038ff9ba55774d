/**
 * Command line: identify the modes of one record.
 *
 *   npm run --silent identify -- --meta rec.json --data rec.csv|rec.f32[.gz]
 *        [--bands 1.0-1.3,1.7-2.2] [--method fdd|ssi|both] [--nperseg 4096]
 *
 * `rec.json` is the `meta` part of the upload contract (PRODUCT.md); the data is CSV (header
 * of channel codes) or float32 little-endian interleaved, either optionally gzip-compressed
 * (detected from the magic bytes). Prints the result as JSON on stdout. Bad input: a message
 * on stderr and exit code 2.
 */
import { readFileSync } from "node:fs";
import { gunzipSync } from "node:zlib";
import { identifyModes, type IdentifyOptions } from "@/lib/modal/identify";
import { isGzip, parseCsvRecord, parseFloat32Record, parseRecordMeta } from "@/lib/signal/parse-record";
import { decimationFactorForBand } from "@/lib/signal/decimate";
import { toMetresPerSecondSquared } from "@/lib/signal/units";

class UsageError extends Error {}

const USAGE = "usage: npm run --silent identify -- --meta rec.json --data rec.csv|rec.f32 [--bands 1.0-1.3,1.7-2.2] [--method fdd|ssi|both] [--nperseg N]";

function parseArgs(argv: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith("--")) throw new UsageError(`unexpected argument ${JSON.stringify(a)}`);
    const [key, inline] = a.slice(2).split("=", 2);
    if (!["meta", "data", "bands", "method", "nperseg", "help"].includes(key)) throw new UsageError(`unknown option --${key}`);
    if (key === "help") {
      out.help = "1";
      continue;
    }
    const value = inline ?? argv[++i];
    if (value === undefined || value.startsWith("--")) throw new UsageError(`--${key} needs a value`);
    out[key] = value;
  }
  return out;
}

function parseBands(s: string): [number, number][] {
  return s.split(",").map((part) => {
    const m = /^\s*([0-9]*\.?[0-9]+)\s*-\s*([0-9]*\.?[0-9]+)\s*$/.exec(part);
    if (!m) throw new UsageError(`--bands must look like 1.0-1.3,1.7-2.2 (got ${JSON.stringify(part)})`);
    const lo = Number(m[1]), hi = Number(m[2]);
    if (!(lo < hi)) throw new UsageError(`--bands: lower edge must be below upper edge (got ${part})`);
    return [lo, hi];
  });
}

function read(path: string, what: string): Uint8Array {
  try {
    const bytes = new Uint8Array(readFileSync(path));
    return isGzip(bytes) ? new Uint8Array(gunzipSync(bytes)) : bytes;
  } catch (e) {
    throw new UsageError(`cannot read ${what} ${path}: ${(e as Error).message}`);
  }
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (args.help) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (!args.meta || !args.data) throw new UsageError("--meta and --data are required");
  let metaJson: unknown;
  try {
    metaJson = JSON.parse(new TextDecoder().decode(read(args.meta, "meta")));
  } catch (e) {
    if (e instanceof UsageError) throw e;
    throw new UsageError(`meta is not valid JSON: ${(e as Error).message}`);
  }
  const meta = parseRecordMeta(metaJson);
  const bytes = read(args.data, "data");
  const name = args.data.replace(/\.gz$/i, "").toLowerCase();
  let raw: Float64Array[];
  if (name.endsWith(".csv")) raw = parseCsvRecord(new TextDecoder().decode(bytes), meta.channels);
  else if (name.endsWith(".f32") || name.endsWith(".bin")) raw = parseFloat32Record(bytes, meta.channels.length);
  else throw new UsageError(`--data must end in .csv or .f32 (optionally .gz) (got ${args.data})`);
  const data = raw.map((x) => toMetresPerSecondSquared(x, meta.units));

  const method = args.method ?? "fdd";
  if (!["fdd", "ssi", "both"].includes(method)) throw new UsageError(`--method must be fdd, ssi or both (got ${method})`);
  const options: IdentifyOptions = { methods: method === "both" ? ["fdd", "ssi"] : [method as "fdd" | "ssi"] };
  if (args.bands) {
    options.bandsHz = parseBands(args.bands);
    // The lowest band edge drives the automatic segment-length rule (and its warning when
    // the record is too short for trustworthy damping).
    options.lowestFrequencyHz = Math.min(...options.bandsHz.map((b) => b[0]));
    // SSI-COV cost grows with the sample count: decimate to a rate that keeps the bands
    // below 0.8 of the new Nyquist (the FDD path keeps the full rate).
    const top = Math.max(...options.bandsHz.map((b) => b[1]));
    if (top < meta.sampleRateHz / 2) {
      const q = decimationFactorForBand(meta.sampleRateHz, top);
      if (q > 1) options.ssiSampleRateHz = meta.sampleRateHz / q;
    }
  }
  if (args.nperseg) options.nperseg = Number(args.nperseg);

  const result = identifyModes({ sampleRateHz: meta.sampleRateHz, channels: meta.channels, data }, options);
  const out = {
    recordId: meta.recordId,
    modes: result.modes.map((m) => ({
      frequencyHz: m.frequencyHz,
      dampingRatio: m.dampingRatio,
      dampingMethod: m.dampingMethod,
      dampingReliable: m.dampingReliable,
      halfPower: m.halfPower ? { dampingRatio: m.halfPower.dampingRatio, q: m.halfPower.q, lossFactor: m.halfPower.lossFactor } : null,
      ssi: m.ssi ? { frequencyHz: m.ssi.frequencyHz, dampingRatio: m.ssi.dampingRatio } : null,
      mpc: m.mpc,
      possiblyCoupled: m.possiblyCoupled,
      shape: Object.fromEntries(result.channels.map((c, i) => [c, m.shape[i]])),
    })),
    quality: {
      verdict: result.quality.verdict,
      channels: result.quality.channels.map((q) => ({ channel: q.channel, flags: q.flags, rms: q.rms, notes: q.notes })),
    },
    spectral: result.spectral,
    warnings: result.warnings,
    timingsMs: result.timingsMs,
  };
  process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
}

try {
  main();
} catch (e) {
  if (e instanceof UsageError || e instanceof TypeError || e instanceof RangeError) {
    process.stderr.write(`identify: ${e.message}\n${e instanceof UsageError ? `${USAGE}\n` : ""}`);
    process.exit(2);
  }
  process.stderr.write(`identify: unexpected error: ${(e as Error).stack ?? String(e)}\n`);
  process.exit(1);
}
