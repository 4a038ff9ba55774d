/**
 * Geometry of a mode shape on the sensor layout: each channel's modal value acts along its
 * measuring direction at its position; channels at one position add up to one displacement
 * vector. Views project onto two axes (plan x–y, elevation x–z). Pure, so it is testable.
 */
import type { LayoutChannel } from "./types";

export type Vec3 = { x: number; y: number; z: number };
export type Axis = "x" | "y" | "z";

export interface ShapeNode {
  codes: string[];
  position: Vec3;
  /** Sum of direction × modal value of the channels here (dimensionless, max |component| ≤ 1). */
  displacement: Vec3;
  /** False when none of its channels is in the shape (left out by the quality screening). */
  measured: boolean;
}

const DIR: Record<LayoutChannel["direction"], Vec3> = {
  x: { x: 1, y: 0, z: 0 }, y: { x: 0, y: 1, z: 0 }, z: { x: 0, y: 0, z: 1 },
  "-x": { x: -1, y: 0, z: 0 }, "-y": { x: 0, y: -1, z: 0 }, "-z": { x: 0, y: 0, z: -1 },
};

/** Nodes of the layout (channels grouped by position to the millimetre) with their displacement. */
export function shapeNodes(layout: LayoutChannel[], shape: Record<string, number>): ShapeNode[] {
  const byKey = new Map<string, ShapeNode>();
  for (const c of layout) {
    const p = c.positionM;
    const key = `${Math.round(p.x * 1000)}:${Math.round(p.y * 1000)}:${Math.round(p.z * 1000)}`;
    const node = byKey.get(key) ?? { codes: [], position: { ...p }, displacement: { x: 0, y: 0, z: 0 }, measured: false };
    node.codes.push(c.code);
    const v = shape[c.code];
    if (v !== undefined && Number.isFinite(v)) {
      const d = DIR[c.direction];
      node.displacement = { x: node.displacement.x + d.x * v, y: node.displacement.y + d.y * v, z: node.displacement.z + d.z * v };
      node.measured = true;
    }
    byKey.set(key, node);
  }
  return [...byKey.values()];
}

/** The axis along which the positions spread most (span of a bridge, height of a tower). */
export function mainAxis(points: Vec3[]): Axis {
  const ext = (a: Axis) => (points.length ? Math.max(...points.map((p) => p[a])) - Math.min(...points.map((p) => p[a])) : 0);
  const e = { x: ext("x"), y: ext("y"), z: ext("z") };
  return e.z > e.x && e.z >= e.y ? "z" : e.y > e.x ? "y" : "x";
}

export interface Station {
  position: Vec3;
  displacement: Vec3;
}

/**
 * Stations along the main axis: the mean position and displacement of the nodes at each
 * main-axis coordinate, plus fixed supports (zero displacement), sorted along the axis.
 * The centreline of the drawing runs through them.
 */
export function stations(nodes: ShapeNode[], supports: Vec3[], axis: Axis): Station[] {
  const groups = new Map<number, ShapeNode[]>();
  for (const n of nodes.filter((n) => n.measured)) {
    const k = Math.round(n.position[axis] * 1000);
    groups.set(k, [...(groups.get(k) ?? []), n]);
  }
  const mean = (vs: Vec3[]): Vec3 => ({
    x: vs.reduce((s, v) => s + v.x, 0) / vs.length,
    y: vs.reduce((s, v) => s + v.y, 0) / vs.length,
    z: vs.reduce((s, v) => s + v.z, 0) / vs.length,
  });
  const out: Station[] = [...groups.values()].map((g) => ({ position: mean(g.map((n) => n.position)), displacement: mean(g.map((n) => n.displacement)) }));
  for (const s of supports) {
    if (!out.some((o) => Math.abs(o.position[axis] - s[axis]) < 1e-3)) out.push({ position: s, displacement: { x: 0, y: 0, z: 0 } });
  }
  return out.sort((a, b) => a.position[axis] - b.position[axis]);
}
