/**
 * Fresh demo records on every `npm start` (issue 4 §8): for each Larkspur demo asset, a few
 * short simulated records go through the real upload API with the asset's demo gateway key
 * (scripts/lib/gateway-sim.ts), then the script waits for the worker's answers and prints one
 * line per asset. Demo databases only (the keys exist only where the demo seed ran).
 *
 *   tsx scripts/demo-fresh-records.ts [--url http://127.0.0.1:3000] [--count 2]
 */
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { demoModels, siteTemperatureC } from "@/db/seeds/larkspur/demo-modal";
import { frequencyAtTemperature } from "@/lib/simulate";
import { demoGatewayKey } from "@/db/seeds/larkspur/seed-demo";
import { runGatewaySimulation, type UploadAnswer } from "./lib/gateway-sim";

const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
};
const url = arg("url", "http://127.0.0.1:3000").replace(/\/$/, "");
const count = Math.max(1, Number(arg("count", "2")) || 2);
/** Assets whose demo story includes a defect, echoed in their fresh records. */
const DEFECTS: Record<string, string> = { "carrow-hill": "flatLine:A4" };

interface RecordRead {
  record: { status: string; failureReason: string | null };
  analysis: { verdict: string; modes: unknown[]; trackedModes: { label: string; frequencyHz: number | null }[] } | null;
}

const recordIdOf = (a: UploadAnswer): string | null => {
  const b = a.body as { record?: { id?: unknown } } | null;
  return typeof b?.record?.id === "string" ? b.record.id : null;
};

/** Wait (≤ 90 s) for the record to leave the queue; a short answer for the summary line. */
async function outcome(key: string, id: string): Promise<string> {
  const deadline = Date.now() + 90_000;
  for (;;) {
    const res = await fetch(`${url}/api/v1/records/${id}`, { headers: { authorization: `Bearer ${key}` } });
    if (!res.ok) return `read ${res.status}`;
    const v = (await res.json()) as RecordRead;
    if (v.record.status === "analysed" && v.analysis) {
      const found = v.analysis.trackedModes.filter((t) => t.frequencyHz !== null).map((t) => `${t.frequencyHz?.toFixed(2)}`);
      return `${v.analysis.verdict}, ${v.analysis.modes.length} modes (tracked ${found.join("/") || "none"} Hz)`;
    }
    if (v.record.status === "failed" || v.record.status === "rejected") return `${v.record.status}${v.record.failureReason ? `: ${v.record.failureReason}` : ""}`;
    if (Date.now() > deadline) return `still ${v.record.status}`;
    await new Promise((r) => setTimeout(r, 1000));
  }
}

async function main(): Promise<void> {
  const models = demoModels(DEMO_ASSETS);
  // Fresh records continue the demo history's story: the site temperature of now, the same
  // frequency–temperature relation, and Heron Reach's stiffness loss.
  const temperatureC = siteTemperatureC(new Date());
  for (const [i, asset] of DEMO_ASSETS.entries()) {
    const key = demoGatewayKey(asset.gateway.slug);
    const model = models[i];
    const stiffness = model.damage?.stiffnessFactor ?? 1;
    const f20ByLabel = new Map(model.modes.map((m) => [m.label, m.f20]));
    try {
      const { answers } = await runGatewaySimulation({
        url, key, count, intervalS: 0, durationS: 300, rateHz: 50, seed: (Date.now() % 1e6) + 100 * i, defects: DEFECTS[asset.gateway.slug],
        temperatureC: () => temperatureC,
        trackedModeFrequencyHz: (m) => frequencyAtTemperature(f20ByLabel.get(m.label) ?? m.nominalFrequencyHz, temperatureC, model.sensitivity) * Math.sqrt(stiffness),
      });
      const parts = await Promise.all(answers.map(async (a) => {
        const id = recordIdOf(a);
        return `${a.status} in ${a.ms} ms → ${id ? await outcome(key, id) : JSON.stringify(a.body)}`;
      }));
      console.log(`[demo] ${asset.name}: ${parts.join("; ")}`);
    } catch (e) {
      console.log(`[demo] ${asset.name}: ${e instanceof Error ? e.message : String(e)}`);
    }
  }
}

void main();
