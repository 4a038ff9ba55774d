"use client";

import { useEffect, useState } from "react";
import { Layer, Source } from "react-map-gl/maplibre";
import { BASEMAP_COLORS, loadBasemap, type BasemapData } from "./basemap";

/** Land fill and country borders from the bundled Natural Earth data (offline style only). */
export function BasemapLayers({ beforeId }: { beforeId?: string }) {
  const [data, setData] = useState<BasemapData | null>(null);
  useEffect(() => {
    let alive = true;
    void loadBasemap().then((d) => {
      if (alive) setData(d);
    });
    return () => {
      alive = false;
    };
  }, []);
  if (!data) return null;
  return (
    <>
      <Source id="basemap-land" type="geojson" data={data.land} attribution="Natural Earth">
        <Layer id="basemap-land-fill" type="fill" beforeId={beforeId} paint={{ "fill-color": BASEMAP_COLORS.land }} />
        <Layer
          id="basemap-coast"
          type="line"
          beforeId={beforeId}
          paint={{ "line-color": BASEMAP_COLORS.coast, "line-width": 0.8 }}
        />
      </Source>
      <Source id="basemap-borders" type="geojson" data={data.borders}>
        <Layer
          id="basemap-borders-line"
          type="line"
          beforeId={beforeId}
          paint={{ "line-color": BASEMAP_COLORS.border, "line-width": 0.7, "line-dasharray": [3, 2] }}
        />
      </Source>
    </>
  );
}
