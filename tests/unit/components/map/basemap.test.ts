import { describe, expect, it } from "vitest";
import { feature } from "topojson-client";
import type { Position } from "geojson";
import type { GeometryCollection, Topology } from "topojson-specification";
import countries from "world-atlas/countries-50m.json";
import { unwrapLongitudes } from "@/components/map/basemap";

type Countries = Topology<{ countries: GeometryCollection; land: GeometryCollection }>;

function maxStep(path: Position[]): number {
  let m = 0;
  for (let i = 1; i < path.length; i++) m = Math.max(m, Math.abs(path[i][0] - path[i - 1][0]));
  return m;
}

function rings(): Position[][] {
  const topo = countries as unknown as Countries;
  const land = feature(topo, topo.objects.land);
  const out: Position[][] = [];
  for (const f of "features" in land ? land.features : [land]) {
    const g = f.geometry;
    if (g.type === "Polygon") out.push(...g.coordinates);
    if (g.type === "MultiPolygon") for (const p of g.coordinates) out.push(...p);
  }
  return out;
}

describe("unwrapLongitudes", () => {
  it("continues a path across the antimeridian instead of jumping 358°", () => {
    const out = unwrapLongitudes([[179, 65], [-179, 66], [-178, 67], [179.5, 64]]);
    expect(out.map((p) => p[0])).toEqual([179, 181, 182, 179.5]);
    expect(out.map((p) => p[1])).toEqual([65, 66, 67, 64]);
  });

  it("moves every point by a whole number of turns (360°), so positions on the globe are unchanged", () => {
    const input: Position[] = [[-170, 0], [170, 1], [-175, 2], [10, 3]];
    const out = unwrapLongitudes(input);
    out.forEach((p, i) => expect(((p[0] - input[i][0]) / 360) % 1).toBeCloseTo(0, 12));
  });

  it("leaves Natural Earth land rings with no step wider than 180° (no streaks across the map)", () => {
    const all = rings();
    // Natural Earth 1:50m has rings touching ±180 (Chukotka, Fiji, Antarctica); the raw data
    // must show the problem, or this test would prove nothing.
    expect(all.some((r) => maxStep(r) > 180)).toBe(true);
    for (const r of all) expect(maxStep(unwrapLongitudes(r))).toBeLessThanOrEqual(180);
  });
});
