/**
 * Modal models and site climate of the Larkspur demo assets (invented), for the demo history.
 *
 * Shapes come from lib/simulate's beam models evaluated at each asset's channel positions:
 * footbridges as simply supported beams along x (vertical bending on the z channels, lateral
 * bending on the y channels, torsion as the first bending shape with the sign of the channel's
 * side y), towers as cantilevers along z (bending in x and y on the matching channels).
 * Cantilever frequencies follow the beam model (rigidity chosen for the stated first
 * frequency, so the second is ≈ 6.27 × the first [pub: Blevins, Formulas for Natural Frequency
 * and Mode Shape, table 8-1]); footbridge frequencies are plausible values for the span and
 * type (cable stays keep the cable-stayed deck's modes close together).
 *
 * Temperature: a continental site (annual mean 9 °C, ±14 °C annual swing peaking in late
 * July, ±6 °C daily swing peaking at 15:00 local = 22:00 UTC, a few days' "weather" on top),
 * so winter nights go well below zero. Frequencies follow lib/simulate's bilinear
 * frequency–temperature relation [pub: Peeters & De Roeck 2001] with a stiffer cold branch.
 */
import { cantileverBeamModes, simplySupportedBeamModes, type TemperatureSensitivity } from "../../../lib/simulate";
import type { DemoAsset, DemoChannel } from "./data";

export interface DemoModeModel {
  label: string;
  /** Frequency at 20 °C, Hz. */
  f20: number;
  /** Search band as a fraction of the nominal frequency (±). */
  bandFraction: number;
  /** Reference shape by channel code, largest |entry| = 1. */
  shape: Record<string, number>;
  /** Mean damping ratio. */
  damping: number;
  /** Chance that one record identifies the mode (ambient excitation varies). */
  identifyRate: number;
}

export interface DemoAssetModel {
  assetId: string;
  sensitivity: TemperatureSensitivity;
  modes: DemoModeModel[];
  /** Stiffness factor applied in the last `days` (frequencies × √factor). */
  damage?: { stiffnessFactor: number; days: number };
  /** A channel flat-lined in the last `days` (quality flag, left out of the analysis). */
  flatLine?: { channel: string; days: number };
}

function normalise(shape: Record<string, number>): Record<string, number> {
  const max = Math.max(...Object.values(shape).map(Math.abs));
  return Object.fromEntries(Object.entries(shape).map(([k, v]) => [k, Math.round((v / max) * 1e4) / 1e4]));
}

/** Simply supported beam shape of order n along the span, at each channel x. */
function beamShape(asset: DemoAsset, n: number, picked: (c: DemoChannel) => boolean, sign: (c: DemoChannel) => number = () => 1) {
  const L = asset.mainDimensionM;
  const [mode] = simplySupportedBeamModes({
    lengthM: L, flexuralRigidityNm2: 1e9, massPerLengthKgPerM: 1000, sensorPositionsM: asset.channels.map((c) => c.positionM.x), modeCount: n,
  }).slice(n - 1);
  return normalise(Object.fromEntries(asset.channels.map((c, i) => [c.code, picked(c) ? mode.shape[i] * sign(c) : 0])));
}

function bridge(asset: DemoAsset, spec: { v1: number; v2: number; lateral: number; torsion: number | null }, sensitivity: TemperatureSensitivity): DemoAssetModel {
  const z = (c: DemoChannel) => c.direction === "z";
  const y = (c: DemoChannel) => c.direction === "y";
  const side = (c: DemoChannel) => Math.sign(c.positionM.y);
  const modes: DemoModeModel[] = [
    { label: "1st vertical bending", f20: spec.v1, bandFraction: 0.1, shape: beamShape(asset, 1, z), damping: 0.012, identifyRate: 0.98 },
    { label: "1st lateral", f20: spec.lateral, bandFraction: 0.1, shape: beamShape(asset, 1, y), damping: 0.015, identifyRate: 0.95 },
    { label: "2nd vertical bending", f20: spec.v2, bandFraction: 0.1, shape: beamShape(asset, 2, z), damping: 0.01, identifyRate: 0.9 },
  ];
  if (spec.torsion !== null) {
    modes.push({ label: "1st torsion", f20: spec.torsion, bandFraction: 0.08, shape: beamShape(asset, 1, (c) => z(c) && c.positionM.y !== 0, side), damping: 0.009, identifyRate: 0.88 });
  }
  return { assetId: asset.id, sensitivity, modes: modes.sort((a, b) => a.f20 - b.f20) };
}

/** Cantilever tower: first and second bending in x and y; rigidity chosen for the stated first frequencies. */
function tower(asset: DemoAsset, f1x: number, f1y: number, sensitivity: TemperatureSensitivity): DemoAssetModel {
  const L = asset.mainDimensionM;
  const m = 400;
  const modes: DemoModeModel[] = [];
  for (const [dir, f1] of [["x", f1x], ["y", f1y]] as const) {
    // f₁ = (β₁L)²/(2πL²)·√(EI/m) [pub: Blevins table 8-1] → EI = m·(2πf₁L²/(β₁L)²)².
    const ei = m * ((2 * Math.PI * f1 * L * L) / 1.875104 ** 2) ** 2;
    const beam = cantileverBeamModes({ lengthM: L, flexuralRigidityNm2: ei, massPerLengthKgPerM: m, sensorPositionsM: asset.channels.map((c) => c.positionM.z), modeCount: 2 });
    beam.forEach((b, j) => {
      const shape = normalise(Object.fromEntries(asset.channels.map((c, i) => [c.code, c.direction === dir ? b.shape[i] : 0])));
      modes.push({
        label: `${j === 0 ? "1st" : "2nd"} bending (${dir})`, f20: Math.round(b.frequencyHz * 1000) / 1000, bandFraction: j === 0 ? 0.08 : 0.1,
        shape, damping: j === 0 ? 0.007 : 0.01, identifyRate: j === 0 ? 0.97 : 0.9,
      });
    });
  }
  return { assetId: asset.id, sensitivity, modes: modes.sort((a, b) => a.f20 - b.f20) };
}

/** The five demo assets' models, in DEMO_ASSETS order. */
export function demoModels(assets: readonly DemoAsset[]): DemoAssetModel[] {
  const byName = (part: string) => {
    const a = assets.find((x) => x.name.includes(part));
    if (!a) throw new Error(`demo asset ${part} missing`);
    return a;
  };
  const steel: TemperatureSensitivity = { slopePerC: -0.0008, knotC: 0, coldSlopePerC: -0.003 };
  const timber: TemperatureSensitivity = { slopePerC: -0.0015, knotC: 0, coldSlopePerC: -0.004 };
  const mast: TemperatureSensitivity = { slopePerC: -0.0005, knotC: 0, coldSlopePerC: -0.0015 };
  return [
    bridge(byName("Millrace"), { v1: 3.12, lateral: 4.35, torsion: 6.8, v2: 11.9 }, steel),
    bridge(byName("Fernbrook"), { v1: 4.6, lateral: 3.4, torsion: null, v2: 17.6 }, timber),
    { ...bridge(byName("Heron Reach"), { v1: 1.92, lateral: 1.21, torsion: 2.85, v2: 3.55 }, steel), damage: { stiffnessFactor: 0.98, days: 21 } },
    { ...tower(byName("Carrow Hill"), 1.05, 1.11, mast), flatLine: { channel: "A4", days: 24 } },
    tower(byName("Quarry Lane"), 1.32, 1.36, mast),
  ];
}

const DAY_MS = 86_400_000;

/** Invented site air temperature (°C, 0.1 °C) at an instant: annual + daily cycles + slow "weather". */
export function siteTemperatureC(at: Date): number {
  const t = at.getTime();
  const day = t / DAY_MS;
  const yearStart = Date.UTC(at.getUTCFullYear(), 0, 1);
  const doy = (t - yearStart) / DAY_MS;
  const annual = 9 + 14 * Math.cos((2 * Math.PI * (doy - 200)) / 365.25);
  const hourUtc = (t % DAY_MS) / 3_600_000;
  const daily = 6 * Math.cos((2 * Math.PI * (hourUtc - 22)) / 24);
  const weather = 2.5 * Math.sin((2 * Math.PI * day) / 3.7 + 1.1) + 2 * Math.sin((2 * Math.PI * day) / 6.3 + 0.4)
    + 1.5 * Math.sin((2 * Math.PI * day) / 11.9 + 2.3) + 1.2 * Math.sin((2 * Math.PI * day) / 27.1 + 4.0);
  return Math.round((annual + daily + weather) * 10) / 10;
}
