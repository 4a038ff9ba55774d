/**
 * Design values of the Larkspur demo (invented): finite-element frequencies and shapes for
 * Heron Reach and the Quarry Lane tower, so the Design comparison and the serviceability
 * panel have something to show, and the section widths of the two vertical structures for
 * the vortex-shedding check. Millrace is left without design modes (the e2e test enters them).
 *
 * The "FE" frequencies are the demo model's 20 °C frequencies scaled by a few per cent, as a
 * design model typically differs from the built structure; they are demo data, not a design.
 * Idempotent: inserts ignore rows already present (an engineer may have edited them).
 */
import type { Knex } from "knex";
import { DEMO_ASSETS } from "./data";
import { demoModels } from "./demo-modal";
import { stableId } from "./demo-history";

const DESIGN_SOURCE = "Demo: invented FE model of the Larkspur scenario";
/** Design/measured scatter per mode order (demo values). */
const FE_FACTORS = [0.96, 1.05, 0.97, 1.04, 0.95];

function directionOf(label: string): "vertical" | "lateral" | "torsional" | null {
  if (/vertical/i.test(label)) return "vertical";
  if (/lateral/i.test(label)) return "lateral";
  if (/torsion/i.test(label)) return "torsional";
  return null;
}

/**
 * A design shape is never the measured one: the reference shape with a smooth deterministic
 * deviation of about 10 % of its largest entry (MAC ≈ 0.95–0.99 against the measurements).
 */
function designShape(shape: Record<string, number>, order: number): Record<string, number> {
  return Object.fromEntries(Object.entries(shape).map(([code, v], k) =>
    [code, Math.round((v + 0.1 * Math.cos(1.7 * k + order)) * 1e4) / 1e4]));
}

export async function seedDemoDesign(knex: Knex): Promise<void> {
  const models = demoModels(DEMO_ASSETS);
  const byName = (prefix: string) => {
    const k = DEMO_ASSETS.findIndex((a) => a.name.startsWith(prefix));
    return { asset: DEMO_ASSETS[k], model: models[k] };
  };
  await knex.transaction(async (trx) => {
    for (const prefix of ["Heron Reach", "Quarry Lane"]) {
      const { asset, model } = byName(prefix);
      const tracked: { id: string; label: string }[] = await trx("tracked_modes").select("id", "label").where({ asset_id: asset.id });
      const trackedId = new Map(tracked.map((t) => [t.label, t.id]));
      // The tower's design model covers its two first bending modes only.
      const modes = prefix === "Quarry Lane" ? model.modes.filter((m) => m.label.startsWith("1st")) : model.modes;
      await trx("design_modes").insert(modes.map((m, i) => ({
        id: stableId(`design:${asset.id}:${m.label}`), asset_id: asset.id, label: `FE ${m.label}`,
        frequency_hz: Number((m.f20 * FE_FACTORS[i % FE_FACTORS.length]).toFixed(3)), direction: directionOf(m.label),
        shape: JSON.stringify(designShape(m.shape, i)), tracked_mode_id: trackedId.get(m.label) ?? null, source_note: DESIGN_SOURCE,
      }))).onConflict(["asset_id", "label"]).ignore();
    }
    const widths: [string, number, string | null][] = [["Quarry Lane", 0.5, "welded_steel_chimney"], ["Carrow Hill", 0.8, null]];
    for (const [prefix, width, guidance] of widths) {
      await trx("asset_serviceability_settings")
        .insert({ asset_id: byName(prefix).asset.id, section_width_m: width, damping_guidance_key: guidance })
        .onConflict("asset_id").ignore();
    }
  });
}
