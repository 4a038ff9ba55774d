"use client";

import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { mainAxis, shapeNodes, stations, type Axis, type ShapeNode, type Station, type Vec3 } from "./shape-geometry";
import type { LayoutChannel } from "./types";

const W = 560;
const H = 200;
const PAD = 28;
/** Largest drawn displacement, px (the shape is normalised to max |value| = 1). */
const AMP = 0.32 * (H - 2 * PAD);

interface ViewSpec {
  title: string;
  h: Axis;
  v: Axis;
}

const VIEWS: ViewSpec[] = [
  { title: "Plan", h: "x", v: "y" },
  { title: "Elevation", h: "x", v: "z" },
];

function scaler(values: number[], lo: number, hi: number, minRange: number, invert: boolean) {
  let a = Math.min(...values);
  let b = Math.max(...values);
  if (b - a < minRange) {
    const m = (a + b) / 2;
    a = m - minRange / 2;
    b = m + minRange / 2;
  }
  return (u: number) => (invert ? hi - ((u - a) / (b - a)) * (hi - lo) : lo + ((u - a) / (b - a)) * (hi - lo));
}

/** One label per projected point: nodes that fall on one spot in this view share it. */
function labels(nodes: ShapeNode[], at: (n: ShapeNode) => readonly [number, number]) {
  const byPoint = new Map<string, { x: number; y: number; codes: string[] }>();
  for (const n of nodes) {
    const [x, y] = at(n);
    const k = `${Math.round(x)}:${Math.round(y)}`;
    const e = byPoint.get(k) ?? { x, y, codes: [] };
    e.codes.push(...n.codes.map((c) => (n.measured ? c : `${c} (not used)`)));
    byPoint.set(k, e);
  }
  return [...byPoint.values()].map((e) => ({ x: e.x, y: e.y, text: e.codes.join(" · ") }));
}

function ProjectedView({ spec, nodes, line, factor }: { spec: ViewSpec; nodes: ShapeNode[]; line: Station[]; factor: number }) {
  const pts: Vec3[] = [...nodes.map((n) => n.position), ...line.map((s) => s.position)];
  const extent = Math.max(...(["x", "y", "z"] as const).map((a) => Math.max(...pts.map((p) => p[a])) - Math.min(...pts.map((p) => p[a]))), 1);
  const sx = scaler(pts.map((p) => p[spec.h]), PAD, W - PAD, extent * 0.25, false);
  const sy = scaler(pts.map((p) => p[spec.v]), PAD, H - PAD, extent * 0.12, true);
  const at = (p: Vec3, d: Vec3, k: number) => [sx(p[spec.h]) + d[spec.h] * AMP * k, sy(p[spec.v]) - d[spec.v] * AMP * k] as const;
  const path = (k: number) => line.map((s, i) => `${i ? "L" : "M"}${at(s.position, s.displacement, k).join(",")}`).join(" ");
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 text-xs font-medium uppercase tracking-wide text-muted">
        {spec.title} <span className="normal-case tracking-normal text-faint">({spec.h} →, {spec.v} ↑)</span>
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full rounded-md border border-line bg-canvas/40" role="img" aria-label={`Mode shape, ${spec.title.toLowerCase()}`}>
        {line.length > 1 ? (
          <>
            <path d={path(0)} fill="none" stroke="#b9c0bb" strokeWidth={1.5} strokeDasharray="5 4" />
            <path d={path(factor)} fill="none" stroke="#24466e" strokeWidth={2.2} data-deformed />
          </>
        ) : null}
        {nodes.map((n) => {
          const [x0, y0] = at(n.position, n.displacement, 0);
          const [x1, y1] = at(n.position, n.displacement, factor);
          return (
            <g key={n.codes.join("+")}>
              <line x1={x0} y1={y0} x2={x1} y2={y1} stroke="#be1e3c" strokeWidth={1} opacity={0.6} />
              <circle cx={x0} cy={y0} r={3} fill="#ffffff" stroke="#8a929c" />
              {n.measured ? <circle cx={x1} cy={y1} r={4} fill="#be1e3c" /> : null}
            </g>
          );
        })}
        {labels(nodes, (n) => at(n.position, n.displacement, 0)).map((l) => (
          <text key={l.text} x={l.x + 5} y={l.y + 14} fontSize={10} fill="#5a6470">{l.text}</text>
        ))}
      </svg>
    </figure>
  );
}

/**
 * The mode shape drawn on the sensor layout, in plan and elevation: undeformed (dashed) against
 * deformed, each sensor's displacement along its measuring direction; animated on demand.
 */
export function ModeShapeView({ layout, shape, supports = [], title }: { layout: LayoutChannel[]; shape: Record<string, number>; supports?: Vec3[]; title: string }) {
  const nodes = useMemo(() => shapeNodes(layout, shape), [layout, shape]);
  const axis = useMemo(() => mainAxis([...nodes.map((n) => n.position), ...supports]), [nodes, supports]);
  const line = useMemo(() => stations(nodes, supports, axis), [nodes, supports, axis]);
  const [animate, setAnimate] = useState(false);
  const [phase, setPhase] = useState(1);
  const factor = animate ? phase : 1;
  useEffect(() => {
    if (!animate) return;
    let raf = 0;
    const t0 = performance.now();
    const tick = (t: number) => {
      setPhase(Math.cos(((t - t0) / 1600) * 2 * Math.PI));
      raf = requestAnimationFrame(tick);
    };
    raf = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(raf);
  }, [animate]);

  if (layout.length === 0) return <p className="text-sm text-muted">This asset has no sensor layout to draw the shape on.</p>;
  return (
    <div data-testid="mode-shape" data-animating={animate ? "1" : "0"}>
      <div className="mb-2 flex items-center justify-between gap-3">
        <div className="text-sm font-medium">{title}</div>
        <Button size="sm" variant="secondary" onClick={() => setAnimate((a) => !a)} aria-pressed={animate}>
          {animate ? "Stop" : "Animate"}
        </Button>
      </div>
      <div className="grid gap-3 lg:grid-cols-2">
        {VIEWS.map((v) => (
          <ProjectedView key={v.title} spec={v} nodes={nodes} line={line} factor={factor} />
        ))}
      </div>
    </div>
  );
}
