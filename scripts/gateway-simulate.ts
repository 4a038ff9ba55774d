/**
 * A simulated gateway: asks the server what it is allowed to know (GET /api/v1/gateways/me with
 * its key: the asset's active channels and tracked modes), simulates ambient records with the
 * engine's simulator for that channel layout, and uploads each over HTTP as the contract says
 * (multipart: meta JSON + float32 LE data), printing every answer as one JSON line.
 *
 *   npm run gateway:simulate -- --key <gateway key> [--url http://127.0.0.1:3000] [--count N]
 *     [--interval-s S] [--duration-s 600] [--rate-hz 100] [--seed 1] [--modes 2.1,5.8]
 *     [--defects flatLine:A3,spikes,gap,clip,hum]
 *
 * Mode shapes: a tracked mode's reference shape when it has one, else a smooth shape over the
 * channel positions (half-sine orders along the asset's longest extent). Without tracked modes,
 * pass --modes (Hz). Exit code 2 for bad usage, 1 when the server refuses the key. The work
 * itself lives in scripts/lib/gateway-sim.ts (also used by the launcher's fresh demo records).
 */
import { GatewayRefusedError, runGatewaySimulation, UsageError } from "./lib/gateway-sim";

const USAGE = "usage: npm run gateway:simulate -- --key <key> [--url URL] [--count N] [--interval-s S] [--duration-s S] [--rate-hz Hz] [--seed N] [--modes f1,f2] [--defects kind[:code],...]";
const KEYS = ["key", "url", "count", "interval-s", "duration-s", "rate-hz", "seed", "modes", "defects"];

function parseArgs(argv: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const [key, inline] = argv[i].replace(/^--/, "").split("=", 2);
    if (!argv[i].startsWith("--") || !KEYS.includes(key)) throw new UsageError(`unknown argument ${argv[i]}`);
    const value = inline ?? argv[++i];
    if (value === undefined) throw new UsageError(`--${key} needs a value`);
    out[key] = value;
  }
  if (!out.key) throw new UsageError("--key is required");
  return out;
}

function num(v: string | undefined, fallback: number, name: string, min: number): number {
  if (v === undefined) return fallback;
  const n = Number(v);
  if (!Number.isFinite(n) || n < min) throw new UsageError(`--${name} must be a number ≥ ${min} (got ${v})`);
  return n;
}

async function main(): Promise<number> {
  try {
    const a = parseArgs(process.argv.slice(2));
    await runGatewaySimulation({
      url: a.url ?? "http://127.0.0.1:3000", key: a.key,
      count: num(a.count, 1, "count", 1), intervalS: num(a["interval-s"], 0, "interval-s", 0),
      durationS: num(a["duration-s"], 600, "duration-s", 1), rateHz: num(a["rate-hz"], 100, "rate-hz", 1),
      seed: num(a.seed, Date.now() % 1e6, "seed", 0),
      modesHz: a.modes ? a.modes.split(",").map((f) => num(f, 0, "modes", 0.01)) : undefined, defects: a.defects,
      onAnswer: (answer) => process.stdout.write(`${JSON.stringify(answer)}\n`),
    });
    return 0;
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n${USAGE}\n`);
      return 2;
    }
    if (e instanceof GatewayRefusedError) {
      process.stderr.write(`${e.message}\n`);
      return 1;
    }
    throw e;
  }
}

void main().then((code) => {
  process.exitCode = code;
});
