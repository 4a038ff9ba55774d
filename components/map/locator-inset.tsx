"use client";

import { useEffect, useState } from "react";
import { feature } from "topojson-client";
import type { GeometryCollection, Topology } from "topojson-specification";
import { BASEMAP_COLORS, unwrapLongitudes } from "./basemap";

/** [[west, south], [east, north]] in degrees. */
export type ViewBounds = [[number, number], [number, number]];

const HALF_WIDTH_DEG = 32;
const HALF_HEIGHT_DEG = 18;

/** Land outlines (Natural Earth 1:110m) as one SVG path in plate carrée degrees (y = −latitude). */
async function loadLandPath(): Promise<string> {
  const mod = await import("world-atlas/land-110m.json");
  const topo = (mod.default ?? mod) as unknown as Topology<{ land: GeometryCollection }>;
  const land = feature(topo, topo.objects.land);
  const parts: string[] = [];
  for (const f of "features" in land ? land.features : [land]) {
    const g = f.geometry;
    const polys = g.type === "Polygon" ? [g.coordinates] : g.type === "MultiPolygon" ? g.coordinates : [];
    for (const poly of polys) {
      for (const ring of poly) {
        const pts = unwrapLongitudes(ring);
        parts.push(`M${pts.map((p) => `${p[0].toFixed(2)},${(-p[1]).toFixed(2)}`).join("L")}Z`);
      }
    }
  }
  return parts.join("");
}

/**
 * A small locator in the map's corner: the surrounding continent with a box around the area
 * the main map shows, so a close view of a few sites still says where on Earth they are.
 * Plain SVG (no second WebGL context).
 */
export function LocatorInset({ bounds, className }: { bounds: ViewBounds | null; className?: string }) {
  const [path, setPath] = useState<string | null>(null);
  useEffect(() => {
    let alive = true;
    void loadLandPath().then((p) => {
      if (alive) setPath(p);
    });
    return () => {
      alive = false;
    };
  }, []);
  if (!bounds || !path) return null;
  const [[w, s], [e, n]] = bounds;
  const cx = (w + e) / 2;
  const cy = Math.max(-70, Math.min(70, (s + n) / 2));
  // Keep the box visible however far the main map is zoomed in.
  const bw = Math.max(e - w, 1.6);
  const bh = Math.max(n - s, 1.2);
  return (
    <div className={className} data-testid="map-locator" aria-hidden>
      <svg
        viewBox={`${cx - HALF_WIDTH_DEG} ${-cy - HALF_HEIGHT_DEG} ${2 * HALF_WIDTH_DEG} ${2 * HALF_HEIGHT_DEG}`}
        className="block h-[72px] w-32"
        preserveAspectRatio="xMidYMid slice"
      >
        <rect x={cx - 200} y={-cy - 100} width={400} height={200} fill={BASEMAP_COLORS.water} />
        <path d={path} fill={BASEMAP_COLORS.land} stroke={BASEMAP_COLORS.coast} strokeWidth={0.35} />
        <rect x={cx - bw / 2} y={-cy - bh / 2} width={bw} height={bh} fill="none" stroke="#24466e" strokeWidth={0.8} />
      </svg>
    </div>
  );
}
