/**
 * Direction of a tracked mode for the footbridge rules (pure): from words in its label
 * ("vertical", "lateral", "torsion"…), else from where its reference shape is largest
 * (z channels → vertical, x/y channels → lateral) [practice: a guess the engineer can
 * correct on the design page].
 */
import type { ModeDirection } from "./footbridge-frequency";

export function directionFromLabel(label: string): ModeDirection | null {
  const l = label.toLowerCase();
  if (/torsion|twist/.test(l)) return "torsional";
  if (/lateral|horizontal|transverse|sway/.test(l)) return "lateral";
  if (/vertical|bending|heave/.test(l) && !/\((x|y)\)/.test(l)) return "vertical";
  return null;
}

/**
 * @param shape - reference shape by channel code; @param channelAxis - channel code → axis ("x", "y", "z", signs ignored).
 * @returns vertical when the z channels carry most of the shape's energy, lateral when x/y do, null without a shape.
 */
export function directionFromShape(shape: Record<string, number> | null, channelAxis: Record<string, string>): ModeDirection | null {
  if (!shape) return null;
  let vertical = 0;
  let horizontal = 0;
  for (const [code, v] of Object.entries(shape)) {
    const axis = (channelAxis[code] ?? "").replace("-", "");
    if (axis === "z") vertical += v * v;
    else if (axis === "x" || axis === "y") horizontal += v * v;
  }
  if (vertical === 0 && horizontal === 0) return null;
  return vertical >= horizontal ? "vertical" : "lateral";
}
