/**
 * Damping guidance to set measured damping against (pure, no I/O).
 *
 * - Towers, masts, chimneys: structural logarithmic decrements δs of EN 1991-1-4 Annex F,
 *   Table F.2 [pub, from memory: verify the table before quoting].
 * - Footbridges: critical damping ratios by deck material used for comfort design in European
 *   footbridge guidance (HiVoSS 2008 / Sétra 2006: "minimum" and "mean" values) [pub, from
 *   memory; the figures are also common practice].
 * Log decrement and damping ratio: δ = 2πζ/√(1 − ζ²) ≈ 2πζ for light damping
 * [pub: Chopra, Dynamics of Structures, §2.2.4]; the exact form is used here.
 */

export interface TowerDampingType {
  key: string;
  label: string;
  /** Structural log decrement δs (dimensionless). */
  logDecrement: number;
  source: string;
}

const F2 = "EN 1991-1-4 Annex F, Table F.2 (from memory; verify)";

/** EN 1991-1-4 Table F.2 rows relevant to towers, masts and chimneys [pub, from memory]. */
export const TOWER_DAMPING_TYPES: readonly TowerDampingType[] = [
  { key: "welded_steel_chimney", label: "Welded steel chimney without external insulation", logDecrement: 0.012, source: F2 },
  { key: "steel_chimney_insulated", label: "Welded steel chimney with external insulation", logDecrement: 0.02, source: F2 },
  { key: "rc_tower_chimney", label: "Reinforced concrete tower or chimney", logDecrement: 0.03, source: F2 },
  { key: "lattice_welded", label: "Lattice steel tower, welded", logDecrement: 0.02, source: F2 },
  { key: "lattice_hs_bolted", label: "Lattice steel tower, high-strength bolts", logDecrement: 0.03, source: F2 },
  { key: "lattice_bolted", label: "Lattice steel tower, ordinary bolts", logDecrement: 0.05, source: F2 },
];

export interface FootbridgeDampingMaterial {
  key: string;
  label: string;
  /** Critical damping ratios (fractions): the lower value design guidance allows, and a mean. */
  minimumRatio: number;
  meanRatio: number;
  source: string;
}

const FB = "European footbridge guidance (HiVoSS/Sétra; from memory, verify)";

/** Footbridge deck damping ratios by material [pub, from memory]. */
export const FOOTBRIDGE_DAMPING_MATERIALS: readonly FootbridgeDampingMaterial[] = [
  { key: "reinforced_concrete", label: "Reinforced concrete", minimumRatio: 0.008, meanRatio: 0.013, source: FB },
  { key: "prestressed_concrete", label: "Prestressed concrete", minimumRatio: 0.005, meanRatio: 0.01, source: FB },
  { key: "composite", label: "Steel–concrete composite", minimumRatio: 0.003, meanRatio: 0.006, source: FB },
  { key: "steel", label: "Steel", minimumRatio: 0.002, meanRatio: 0.004, source: FB },
  { key: "timber", label: "Timber", minimumRatio: 0.01, meanRatio: 0.015, source: FB },
];

/**
 * Log decrement from a damping ratio: δ = 2πζ/√(1 − ζ²).
 * @param dampingRatio - ζ, fraction in [0, 1).
 * @throws TypeError for non-finite input; RangeError outside [0, 1).
 */
export function logDecrementFromDampingRatio(dampingRatio: number): number {
  if (typeof dampingRatio !== "number" || !Number.isFinite(dampingRatio)) throw new TypeError(`dampingRatio must be a finite number (got ${dampingRatio})`);
  if (dampingRatio < 0 || dampingRatio >= 1) throw new RangeError(`dampingRatio must be in [0, 1) (got ${dampingRatio})`);
  return (2 * Math.PI * dampingRatio) / Math.sqrt(1 - dampingRatio * dampingRatio);
}

/**
 * Damping ratio from a log decrement: ζ = δ/√(4π² + δ²) (inverse of the above).
 * @param logDecrement - δ ≥ 0, finite.
 * @throws TypeError for non-finite input; RangeError for δ < 0.
 */
export function dampingRatioFromLogDecrement(logDecrement: number): number {
  if (typeof logDecrement !== "number" || !Number.isFinite(logDecrement)) throw new TypeError(`logDecrement must be a finite number (got ${logDecrement})`);
  if (logDecrement < 0) throw new RangeError(`logDecrement must be ≥ 0 (got ${logDecrement})`);
  return logDecrement / Math.sqrt(4 * Math.PI * Math.PI + logDecrement * logDecrement);
}

/** Picks a Table F.2 row from free-text material words [practice: a guess the engineer can change]. */
export function guessTowerDampingType(kind: string, material: string | null): string {
  const m = (material ?? "").toLowerCase();
  if (/concrete/.test(m)) return "rc_tower_chimney";
  if (/lattice/.test(m)) return /weld/.test(m) ? "lattice_welded" : "lattice_hs_bolted";
  if (kind === "chimney") return /insulat/.test(m) ? "steel_chimney_insulated" : "welded_steel_chimney";
  return "welded_steel_chimney";
}

/** Picks a footbridge material row from free-text material words [practice]. */
export function guessFootbridgeMaterial(material: string | null): string {
  const m = (material ?? "").toLowerCase();
  if (/timber|wood|glulam|laminated/.test(m)) return "timber";
  if (/prestress|post-tension/.test(m)) return "prestressed_concrete";
  if (/composite/.test(m)) return "composite";
  if (/concrete/.test(m)) return "reinforced_concrete";
  return "steel";
}

export type DampingVerdict = "below_guidance" | "within_guidance" | "above_guidance";

/**
 * Where a measured damping ratio sits against a guidance value (the design assumption):
 * below means the structure is livelier than design guidance assumes.
 * @param measuredRatio - measured ζ (fraction), finite ≥ 0.
 * @param lowRatio - guidance lower value (fraction); @param highRatio - upper/mean value (fraction).
 */
export function compareDamping(measuredRatio: number, lowRatio: number, highRatio: number): DampingVerdict {
  if (!Number.isFinite(measuredRatio) || !Number.isFinite(lowRatio) || !Number.isFinite(highRatio)) throw new TypeError("damping ratios must be finite");
  if (lowRatio > highRatio) throw new RangeError(`lowRatio must be ≤ highRatio (got ${lowRatio} > ${highRatio})`);
  if (measuredRatio < lowRatio) return "below_guidance";
  return measuredRatio > highRatio ? "above_guidance" : "within_guidance";
}
