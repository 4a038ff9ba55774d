"use client";

import type { FeatureCollection } from "geojson";
import { useEffect, useState } from "react";
import { Layer, Source } from "react-map-gl/maplibre";
import { BASEMAP_COLORS, graticule, loadBasemap, type BasemapData } from "./basemap";

// 10° lines at every zoom; 1° lines once a region fills the view.
const GRATICULE_10 = graticule(10);
const GRATICULE_1 = graticule(1);

const EMPTY: FeatureCollection = { type: "FeatureCollection", features: [] };

/**
 * Land fill, coasts, borders and graticule (offline style only). Render it before the data
 * layers: its sources start empty so its layers are added first (underneath), and are filled
 * when the Natural Earth chunk has loaded.
 */
export function BasemapLayers() {
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
  return (
    <>
      <Source id="basemap-land" type="geojson" data={data?.land ?? EMPTY} attribution="Natural Earth">
        <Layer id="basemap-land-fill" type="fill" paint={{ "fill-color": BASEMAP_COLORS.land }} />
        <Layer
          id="basemap-coast"
          type="line"
         
          paint={{ "line-color": BASEMAP_COLORS.coast, "line-width": 0.8 }}
        />
      </Source>
      <Source id="basemap-borders" type="geojson" data={data?.borders ?? EMPTY}>
        <Layer
          id="basemap-borders-line"
          type="line"
         
          paint={{ "line-color": BASEMAP_COLORS.border, "line-width": 0.7, "line-dasharray": [3, 2] }}
        />
      </Source>
      <Source id="basemap-graticule-10" type="geojson" data={GRATICULE_10}>
        <Layer id="basemap-graticule-10-line" type="line" paint={{ "line-color": BASEMAP_COLORS.graticule, "line-width": 0.6 }} />
      </Source>
      <Source id="basemap-graticule-1" type="geojson" data={GRATICULE_1}>
        <Layer
          id="basemap-graticule-1-line"
          type="line"
          minzoom={5}
         
          paint={{ "line-color": BASEMAP_COLORS.graticule, "line-width": 0.5, "line-dasharray": [2, 3] }}
        />
      </Source>
    </>
  );
}
