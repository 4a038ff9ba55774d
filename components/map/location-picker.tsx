"use client";

import "maplibre-gl/dist/maplibre-gl.css";
import { useMemo } from "react";
import MapGL, { Layer, NavigationControl, Source, type MapLayerMouseEvent } from "react-map-gl/maplibre";
import type { FeatureCollection, Point } from "geojson";
import { BasemapLayers } from "./basemap-layers";
import { maplibreWorkerUrl, offlineStyle } from "./basemap";

interface Props {
  latitude: number | null;
  longitude: number | null;
  onPick: (latitude: number, longitude: number) => void;
  styleUrl?: string;
}

/** A small map: click to set the asset's location; the point follows typed coordinates. */
export function LocationPicker({ latitude, longitude, onPick, styleUrl }: Props) {
  const style = useMemo(() => (styleUrl ? styleUrl : offlineStyle()), [styleUrl]);
  const workerUrl = useMemo(() => maplibreWorkerUrl(), []);
  const has = latitude !== null && longitude !== null && Number.isFinite(latitude) && Number.isFinite(longitude);
  const point: FeatureCollection<Point> = {
    type: "FeatureCollection",
    features: has ? [{ type: "Feature", properties: {}, geometry: { type: "Point", coordinates: [longitude, latitude] } }] : [],
  };
  return (
    <div className="h-64 overflow-hidden rounded-md border border-line-strong" data-testid="location-picker">
      <MapGL
        mapStyle={style}
        workerUrl={workerUrl}
        initialViewState={has ? { longitude, latitude, zoom: 8 } : { longitude: -100, latitude: 40, zoom: 2.5 }}
        onClick={(e: MapLayerMouseEvent) => {
          const { lat, lng } = e.lngLat.wrap();
          onPick(Number(lat.toFixed(6)), Number(lng.toFixed(6)));
        }}
        cursor="crosshair"
        dragRotate={false}
        attributionControl={{ compact: true }}
        style={{ width: "100%", height: "100%" }}
      >
        {styleUrl ? null : <BasemapLayers />}
        <Source id="picked" type="geojson" data={point}>
          <Layer
            id="picked-point"
            type="circle"
            paint={{ "circle-radius": 7, "circle-color": "#24466e", "circle-stroke-color": "#ffffff", "circle-stroke-width": 2 }}
          />
        </Source>
        <NavigationControl position="top-right" showCompass={false} />
      </MapGL>
    </div>
  );
}
