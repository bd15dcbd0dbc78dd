"use client";
import { DuffMap } from "@/components/map/map";
import type { LatLng, MapMarker } from "@/components/map/types";

export interface MapStop {
  order: number;
  listing_id: string;
  location: LatLng;
}

/** The start point and the numbered stops, joined in visiting order and back to the start. */
export function PlanMap({ origin, stops, onPick }: { origin: LatLng; stops: MapStop[]; onPick?: (p: LatLng) => void }) {
  const markers: MapMarker[] = [
    { id: "origin", lat: origin.lat, lng: origin.lng, tone: "origin", label: "Start and finish" },
    // No hover label on a numbered stop: a Leaflet layer holds one tooltip, and the number is it.
    ...stops.map((s) => ({ id: s.listing_id, lat: s.location.lat, lng: s.location.lng, order: s.order, tone: "listing" as const })),
  ];
  const loop = stops.length ? [origin, ...stops.map((s) => s.location), origin] : undefined;
  return (
    <div className="flex flex-col gap-1">
      <DuffMap
        center={origin}
        zoom={13}
        markers={markers}
        line={loop}
        fitTo={[origin, ...stops.map((s) => s.location)]}
        onClick={onPick}
        label={stops.length ? `Map of the route: ${stops.length} stops, starting and ending at the start point` : "Map of the start point"}
        className="h-80 md:h-[28rem]"
      />
      <p className="text-sm text-humus-600">
        {onPick ? "Tap the map to move the start point. " : ""}Stops are shown at their approximate public points; the exact address comes with a confirmed reservation.
      </p>
    </div>
  );
}
