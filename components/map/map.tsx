"use client";
import dynamic from "next/dynamic";
import type { MapProps } from "./types";

// Leaflet touches `window` on import, so the map renders in the browser only.
const LeafletMap = dynamic(() => import("./leaflet-map").then((m) => m.LeafletMap), {
  ssr: false,
  loading: () => (
    <div className="flex h-80 items-center justify-center rounded-lg bg-humus-100 text-humus-600" role="status">
      Loading the map…
    </div>
  ),
});

export function DuffMap(props: MapProps) {
  return <LeafletMap {...props} />;
}
