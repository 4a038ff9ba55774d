import type { FeatureCollection, Geometry, MultiLineString, MultiPolygon, Polygon, Position } from "geojson";
import type { StyleSpecification } from "maplibre-gl";
import { feature, mesh } from "topojson-client";
import type { GeometryCollection, Topology } from "topojson-specification";

/**
 * The offline basemap: Natural Earth countries (world-atlas, 1:50m) turned into GeoJSON in the
 * browser, drawn over a plain background. No tiles, glyphs or sprites, so nothing is fetched.
 */
export const BASEMAP_COLORS = {
  water: "#dbe5ec",
  land: "#f8f7f1",
  border: "#c2c8c4",
  coast: "#a9b4b8",
  graticule: "#c9d3d8",
} as const;

/**
 * Shift longitudes along a path so that no step jumps more than 180°: a ring that crosses the
 * antimeridian (e.g. 179.9 → −179.9) continues to 180.1 instead of drawing a streak across the
 * whole map. MapLibre draws coordinates beyond ±180 on the neighbouring world copy.
 */
export function unwrapLongitudes(path: readonly Position[]): Position[] {
  const out: Position[] = [];
  let offset = 0;
  let prev: number | null = null;
  for (const p of path) {
    const lon = p[0];
    if (prev !== null) {
      const d = lon + offset - prev;
      if (d > 180) offset -= 360;
      else if (d < -180) offset += 360;
    }
    const shifted = lon + offset;
    out.push([shifted, p[1]]);
    prev = shifted;
  }
  return out;
}

function unwrapGeometry(g: Geometry): Geometry {
  switch (g.type) {
    case "Polygon":
      return { type: "Polygon", coordinates: g.coordinates.map(unwrapLongitudes) } satisfies Polygon;
    case "MultiPolygon":
      return {
        type: "MultiPolygon",
        coordinates: g.coordinates.map((poly) => poly.map(unwrapLongitudes)),
      } satisfies MultiPolygon;
    case "LineString":
      return { type: "LineString", coordinates: unwrapLongitudes(g.coordinates) };
    case "MultiLineString":
      return { type: "MultiLineString", coordinates: g.coordinates.map(unwrapLongitudes) } satisfies MultiLineString;
    default:
      return g;
  }
}

/**
 * Parallels and meridians every `stepDeg` degrees (lines sampled every degree so they follow
 * the Web Mercator projection), for orientation where no land edge is in view.
 */
export function graticule(stepDeg: number): FeatureCollection {
  const features: FeatureCollection["features"] = [];
  for (let lon = -180; lon <= 180; lon += stepDeg) {
    const coords: Position[] = [];
    for (let lat = -85; lat <= 85; lat += 1) coords.push([lon, lat]);
    features.push({ type: "Feature", properties: { kind: "meridian", value: lon }, geometry: { type: "LineString", coordinates: coords } });
  }
  for (let lat = -80; lat <= 80; lat += stepDeg) {
    const coords: Position[] = [];
    for (let lon = -180; lon <= 180; lon += 1) coords.push([lon, lat]);
    features.push({ type: "Feature", properties: { kind: "parallel", value: lat }, geometry: { type: "LineString", coordinates: coords } });
  }
  return { type: "FeatureCollection", features };
}

export interface BasemapData {
  land: FeatureCollection;
  borders: FeatureCollection;
}

type CountriesTopology = Topology<{ countries: GeometryCollection; land: GeometryCollection }>;

/** Load the countries topology (code-split chunk) and build land polygons and inner borders. */
export async function loadBasemap(): Promise<BasemapData> {
  const mod = await import("world-atlas/countries-50m.json");
  const topology = (mod.default ?? mod) as unknown as CountriesTopology;
  const landFc = feature(topology, topology.objects.land);
  const land: FeatureCollection = {
    type: "FeatureCollection",
    features: ("features" in landFc ? landFc.features : [landFc]).map((f) => ({ ...f, geometry: unwrapGeometry(f.geometry) })),
  };
  const borderLines = mesh(topology, topology.objects.countries, (a, b) => a !== b);
  const borders: FeatureCollection = {
    type: "FeatureCollection",
    features: [{ type: "Feature", properties: {}, geometry: unwrapGeometry(borderLines) }],
  };
  return { land, borders };
}

/** A style with only a background layer; land and borders are added as GeoJSON sources. */
export function offlineStyle(): StyleSpecification {
  return {
    version: 8,
    sources: {},
    layers: [{ id: "background", type: "background", paint: { "background-color": BASEMAP_COLORS.water } }],
  };
}

/** `new URL(…, import.meta.url)` lets the bundler emit the worker file and gives its URL (STACK.md). */
export function maplibreWorkerUrl(): string {
  return new URL("maplibre-gl/dist/maplibre-gl-worker.mjs", import.meta.url).href;
}
