"use client";

import "maplibre-gl/dist/maplibre-gl.css";
import Link from "next/link";
import { useCallback, useMemo, useRef, useState } from "react";
import MapGL, {
  Layer,
  NavigationControl,
  Popup,
  ScaleControl,
  Source,
  type MapLayerMouseEvent,
  type MapRef,
} from "react-map-gl/maplibre";
import type { FeatureCollection, Point } from "geojson";
import type { AssetSummary } from "@/lib/domain/types";
import { CONDITION_ORDER, CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionBadge } from "@/components/condition/condition-badge";
import { KIND_LABELS } from "@/components/ui/format";
import { BasemapLayers } from "./basemap-layers";
import { maplibreWorkerUrl, offlineStyle } from "./basemap";
import { LocatorInset, type ViewBounds } from "./locator-inset";
import { MapLegend } from "./map-legend";

const MARKER_LAYER = "asset-markers";
// The locator (top left) and the legend (bottom left) sit over the map: keep markers clear of them.
const FIT_PADDING = { top: 48, bottom: 48, left: 170, right: 56 };

interface Props {
  assets: AssetSummary[];
  /** A MapLibre style URL from the server configuration (MAP_STYLE_URL); empty → offline basemap. */
  styleUrl?: string;
  className?: string;
  /** Closest zoom when fitting the assets (a single asset would otherwise fill the view). */
  maxZoom?: number;
}

type Bounds = [[number, number], [number, number]];

function boundsOf(assets: AssetSummary[]): Bounds | null {
  if (assets.length === 0) return null;
  let minLon = Infinity, minLat = Infinity, maxLon = -Infinity, maxLat = -Infinity;
  for (const a of assets) {
    minLon = Math.min(minLon, a.longitude);
    maxLon = Math.max(maxLon, a.longitude);
    minLat = Math.min(minLat, a.latitude);
    maxLat = Math.max(maxLat, a.latitude);
  }
  // A single asset (or a tight cluster) still gets some surroundings.
  const padLon = Math.max(0.05, (maxLon - minLon) * 0.1);
  const padLat = Math.max(0.05, (maxLat - minLat) * 0.1);
  return [[minLon - padLon, minLat - padLat], [maxLon + padLon, maxLat + padLat]];
}

/** GeoJSON points with the paint values precomputed from the one condition table. */
function toFeatures(assets: AssetSummary[]): FeatureCollection<Point> {
  return {
    type: "FeatureCollection",
    features: assets.map((a) => {
      const s = CONDITION_STYLES[a.condition];
      return {
        type: "Feature",
        id: a.id,
        geometry: { type: "Point", coordinates: [a.longitude, a.latitude] },
        properties: {
          id: a.id,
          condition: a.condition,
          fill: s.fill,
          stroke: s.stroke,
          strokeWidth: s.outline ? 3 : 1.5,
          // Most urgent drawn on top.
          sortKey: CONDITION_ORDER.length - CONDITION_ORDER.indexOf(a.condition),
        },
      };
    }),
  };
}

/**
 * The Portfolio map: every asset as a circle coloured by condition, a legend, and a card with a
 * link when a marker is clicked. `data-rendered-assets` on the wrapper reports how many distinct
 * assets MapLibre actually drew (read back by the browser tests).
 */
export function PortfolioMap({ assets, styleUrl, className, maxZoom = 10 }: Props) {
  const mapRef = useRef<MapRef>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [rendered, setRendered] = useState<number | null>(null);
  const [positions, setPositions] = useState<string>("");
  const [view, setView] = useState<ViewBounds | null>(null);
  const [cursor, setCursor] = useState<string>("");
  const data = useMemo(() => toFeatures(assets), [assets]);
  const bounds = useMemo(() => boundsOf(assets), [assets]);
  const style = useMemo(() => (styleUrl ? styleUrl : offlineStyle()), [styleUrl]);
  const workerUrl = useMemo(() => maplibreWorkerUrl(), []);
  const selected = selectedId ? assets.find((a) => a.id === selectedId) ?? null : null;

  const countRendered = useCallback(() => {
    const map = mapRef.current;
    if (!map || !map.getLayer(MARKER_LAYER)) return;
    const ids = new Set<string>();
    for (const f of map.queryRenderedFeatures({ layers: [MARKER_LAYER] })) {
      const id = f.properties?.id;
      if (typeof id === "string") ids.add(id);
    }
    setRendered(ids.size);
    // Screen position of each asset (canvas pixels), so tests can click a marker.
    const pos: Record<string, { x: number; y: number }> = {};
    for (const a of assets) {
      const p = map.project([a.longitude, a.latitude]);
      pos[a.id] = { x: Math.round(p.x), y: Math.round(p.y) };
    }
    setPositions(JSON.stringify(pos));
    const b = map.getBounds();
    setView([[b.getWest(), b.getSouth()], [b.getEast(), b.getNorth()]]);
  }, [assets]);

  const onClick = useCallback((e: MapLayerMouseEvent) => {
    const id = e.features?.[0]?.properties?.id;
    setSelectedId(typeof id === "string" ? id : null);
  }, []);

  return (
    <div
      className={className ?? "relative h-[460px] overflow-hidden rounded-lg border border-line"}
      data-testid="portfolio-map"
      data-rendered-assets={rendered ?? ""}
      data-asset-count={assets.length}
      data-marker-positions={positions}
    >
      <MapGL
        ref={mapRef}
        mapStyle={style}
        workerUrl={workerUrl}
        initialViewState={bounds ? { bounds, fitBoundsOptions: { padding: FIT_PADDING, maxZoom } } : { longitude: 0, latitude: 20, zoom: 1 }}
        interactiveLayerIds={[MARKER_LAYER]}
        onClick={onClick}
        onMouseEnter={() => setCursor("pointer")}
        onMouseLeave={() => setCursor("")}
        cursor={cursor}
        onIdle={countRendered}
        attributionControl={{ compact: true }}
        dragRotate={false}
        style={{ width: "100%", height: "100%" }}
      >
        {styleUrl ? null : <BasemapLayers />}
        <Source id="assets" type="geojson" data={data}>
          <Layer
            id={MARKER_LAYER}
            type="circle"
            layout={{ "circle-sort-key": ["get", "sortKey"] }}
            paint={{
              "circle-radius": ["interpolate", ["linear"], ["zoom"], 2, 5, 8, 8, 13, 11],
              "circle-color": ["get", "fill"],
              "circle-stroke-color": ["get", "stroke"],
              "circle-stroke-width": ["get", "strokeWidth"],
            }}
          />
        </Source>
        <NavigationControl position="top-right" showCompass={false} />
        <ScaleControl position="bottom-right" unit="metric" maxWidth={120} />
        {selected ? (
          <Popup
            longitude={selected.longitude}
            latitude={selected.latitude}
            anchor="bottom"
            offset={14}
            closeOnClick={false}
            onClose={() => setSelectedId(null)}
            maxWidth="260px"
          >
            <div className="space-y-1 p-0.5 text-ink" data-testid="map-card">
              <div className="font-semibold leading-tight">{selected.name}</div>
              <div className="text-xs text-muted">
                {KIND_LABELS[selected.kind]}
                {selected.mainDimensionM !== null ? ` · ${selected.mainDimensionM} m` : ""}
                {` · ${selected.channelCount} channels`}
              </div>
              <ConditionBadge condition={selected.condition} />
              <div className="pt-1">
                <Link href={`/assets/${selected.id}`} className="text-sm font-medium text-accent hover:underline">
                  Open asset →
                </Link>
              </div>
            </div>
          </Popup>
        ) : null}
      </MapGL>
      <MapLegend className="absolute bottom-3 left-3" />
      {styleUrl ? null : (
        <LocatorInset bounds={view} className="absolute top-3 left-3 overflow-hidden rounded-md border border-line-strong shadow-sm" />
      )}
    </div>
  );
}
