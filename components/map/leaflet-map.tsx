"use client";
import "leaflet/dist/leaflet.css";
import { Fragment, useEffect, useState } from "react";
import { divIcon, type Map as LeafletMapInstance } from "leaflet";
import { CircleMarker, GeoJSON, MapContainer, Marker, Pane, Polygon, Polyline, Rectangle, TileLayer, Tooltip, useMap, useMapEvents } from "react-leaflet";
import type { Feature, FeatureCollection } from "geojson";
import type { PathOptions } from "leaflet";
import { DEFAULT_BASEMAP_URL, sharedEnv } from "@/lib/env-shared";
import type { MapProps } from "./types";

// The base map is Duffbank's own GeoJSON drawing shipped in public/, so the map works with
// no tile server. A production deployment can add real tiles with NEXT_PUBLIC_TILE_URL.
// Both are fixed at build time (lib/env-shared.ts).
const { NEXT_PUBLIC_TILE_URL: TILE_URL, NEXT_PUBLIC_TILE_ATTRIBUTION: TILE_ATTRIBUTION, NEXT_PUBLIC_BASEMAP_URL } = sharedEnv();
const BASEMAP_URL = NEXT_PUBLIC_BASEMAP_URL ?? DEFAULT_BASEMAP_URL;

const STYLE: Record<string, PathOptions> = {
  land: { color: "#ece3d6", weight: 0, fillColor: "#f3ede4", fillOpacity: 1 },
  town: { color: "#d9c6ad", weight: 1, fillColor: "#e8dccb", fillOpacity: 1 },
  wood: { color: "#94b97c", weight: 1, fillColor: "#bcd4ac", fillOpacity: 0.9 },
  park: { color: "#94b97c", weight: 1, fillColor: "#dde9d5", fillOpacity: 1 },
  water: { color: "#7fa7c4", weight: 5, opacity: 0.9 },
  road: { color: "#ffffff", weight: 5, opacity: 1 },
  lane: { color: "#ffffff", weight: 2.5, opacity: 1 },
};

function Basemap() {
  const [data, setData] = useState<FeatureCollection | null>(null);
  useEffect(() => {
    let live = true;
    fetch(BASEMAP_URL)
      .then((r) => r.json())
      .then((d) => live && setData(d))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, []);
  if (!data) return null;
  return (
    <GeoJSON
      data={data}
      style={(f?: Feature) => STYLE[(f?.properties?.kind as string) ?? "land"] ?? {}}
      pointToLayer={() => null as never}
      filter={(f) => f.properties?.kind !== "label"}
      interactive={false}
    />
  );
}

function Labels() {
  const [labels, setLabels] = useState<{ name: string; lat: number; lng: number }[]>([]);
  useEffect(() => {
    fetch(BASEMAP_URL)
      .then((r) => r.json())
      .then((d: FeatureCollection) =>
        setLabels(
          d.features
            .filter((f) => f.properties?.kind === "label" && f.geometry.type === "Point")
            .map((f) => {
              const [lng, lat] = (f.geometry as { coordinates: number[] }).coordinates;
              return { name: String(f.properties?.name), lat, lng };
            }),
        ),
      )
      .catch(() => undefined);
  }, []);
  return (
    <>
      {/* Plain text markers rather than permanent tooltips: a tooltip is created empty and
          filled a moment later, and an empty role="tooltip" has no name for a screen reader. */}
      {labels.map((l) => (
        <Marker key={l.name} position={[l.lat, l.lng]} interactive={false} keyboard={false} icon={placeLabel(l.name)} />
      ))}
    </>
  );
}

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const stopNumber = (n: number) => divIcon({ className: "duff-stop-number", html: String(n), iconSize: [24, 24], iconAnchor: [12, 12] });
const placeLabel = (name: string) => divIcon({ className: "duff-place-label", html: escapeHtml(name), iconSize: [160, 18], iconAnchor: [80, 9] });

function ClickCatcher({ onClick }: { onClick?: (p: { lat: number; lng: number }) => void }) {
  useMapEvents({ click: (e) => onClick?.({ lat: e.latlng.lat, lng: e.latlng.lng }) });
  return null;
}

function FitTo({ points }: { points?: { lat: number; lng: number }[] }) {
  const map = useMap();
  const key = points?.map((p) => `${p.lat},${p.lng}`).join(";");
  useEffect(() => {
    if (points && points.length > 1) map.fitBounds(points.map((p) => [p.lat, p.lng] as [number, number]), { padding: [30, 30], maxZoom: 15 });
    else if (points && points.length === 1) map.setView([points[0].lat, points[0].lng], Math.max(map.getZoom(), 13));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return null;
}

function ViewTo({ view }: { view?: MapProps["view"] }) {
  const map = useMap();
  useEffect(() => {
    if (view) map.setView([view.lat, view.lng], view.zoom ?? Math.max(map.getZoom(), 15));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [view?.lat, view?.lng, view?.zoom]);
  return null;
}

export function LeafletMap({ center, zoom = 13, markers = [], areas = [], polygon, line, onClick, fitTo, view, centrePick, label, className = "h-80" }: MapProps) {
  const [map, setMap] = useState<LeafletMapInstance | null>(null);
  const box = (
    <div className={`relative overflow-hidden rounded-lg ring-1 ring-humus-200 ${className}`} role="region" aria-label={label}>
      {centrePick ? (
        <span aria-hidden="true" className="pointer-events-none absolute left-1/2 top-1/2 z-[500] h-8 w-8 -translate-x-1/2 -translate-y-1/2">
          <span className="absolute left-1/2 top-0 h-full w-0.5 -translate-x-1/2 bg-humus-900" />
          <span className="absolute left-0 top-1/2 h-0.5 w-full -translate-y-1/2 bg-humus-900" />
        </span>
      ) : null}
      <MapContainer ref={setMap} center={[center.lat, center.lng]} zoom={zoom} minZoom={10} maxZoom={18} className="h-full w-full" style={{ background: "#f3ede4" }} attributionControl={!!TILE_URL}>
        {TILE_URL ? (
          <TileLayer url={TILE_URL} attribution={TILE_ATTRIBUTION ?? ""} />
        ) : (
          // Its own pane under the markers: the drawing arrives after the markers are placed and
          // would otherwise be painted over them.
          <Pane name="duff-basemap" style={{ zIndex: 250 }}>
            <Basemap />
          </Pane>
        )}
        {TILE_URL ? null : <Labels />}
        <ClickCatcher onClick={onClick} />
        <FitTo points={fitTo} />
        <ViewTo view={view} />
        {areas.map((a) => (
          <Rectangle
            key={a.id}
            bounds={[
              [a.south, a.west],
              [a.north, a.east],
            ]}
            pathOptions={{ color: "#93600f", weight: 1, fillColor: "#d9962b", fillOpacity: 0.2 + 0.55 * Math.min(1, Math.max(0, a.intensity)) }}
            className="duff-demand-cell"
          >
            <Tooltip>{a.label}</Tooltip>
          </Rectangle>
        ))}
        {polygon && polygon.length > 0 ? (
          polygon.length > 2 ? (
            <Polygon positions={polygon.map((p) => [p.lat, p.lng])} pathOptions={{ color: "#40642e", weight: 3, fillColor: "#94b97c", fillOpacity: 0.45 }} />
          ) : (
            <Polyline positions={polygon.map((p) => [p.lat, p.lng])} pathOptions={{ color: "#40642e", weight: 3, dashArray: "4 4" }} />
          )
        ) : null}
        {polygon?.map((p, i) => <CircleMarker key={`v${i}`} center={[p.lat, p.lng]} radius={5} pathOptions={{ color: "#40642e", fillColor: "#fff", fillOpacity: 1 }} />)}
        {line && line.length > 1 ? <Polyline positions={line.map((p) => [p.lat, p.lng])} pathOptions={{ color: "#93600f", weight: 3, dashArray: "6 6" }} /> : null}
        {markers.map((m) => (
          <Fragment key={m.id}>
            <CircleMarker
              center={[m.lat, m.lng]}
              radius={m.order !== undefined ? 12 : 8}
              pathOptions={{
                color: m.tone === "origin" ? "#271c13" : m.tone === "selected" ? "#93600f" : "#40642e",
                weight: m.tone === "selected" ? 4 : 2,
                fillColor: m.tone === "origin" ? "#d9962b" : m.tone === "selected" ? "#f0c36b" : "#6f9b55",
                fillOpacity: 0.9,
              }}
              // Read once, when Leaflet creates the path; pathOptions updates cannot change it.
              className={m.className}
              eventHandlers={m.onSelect ? { click: m.onSelect } : undefined}
            >
              {m.label ? <Tooltip>{m.label}</Tooltip> : null}
            </CircleMarker>
            {/* The stop's number as plain text over its circle (a permanent tooltip starts out empty, without a name). */}
            {m.order !== undefined ? <Marker position={[m.lat, m.lng]} interactive={false} keyboard={false} icon={stopNumber(m.order)} /> : null}
          </Fragment>
        ))}
      </MapContainer>
    </div>
  );
  if (!centrePick) return box;
  return (
    <div className="flex flex-col gap-2">
      {box}
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <button
          type="button"
          className="min-h-11 rounded-lg px-3 py-2 font-medium ring-1 ring-humus-300 hover:bg-humus-100"
          onClick={() => {
            if (!map) return;
            const c = map.getCenter();
            centrePick.onPick({ lat: c.lat, lng: c.lng });
          }}
        >
          {centrePick.label}
        </button>
        <span className="text-humus-600">Without a mouse: focus the map, move it with the arrow keys (+ and − zoom) until the cross sits on the spot.</span>
      </div>
    </div>
  );
}
