"use client";
import { DuffMap } from "@/components/map/map";
import type { LatLng, MapArea } from "@/components/map/types";

/** The council's demand map: shaded cells (each from at least three people) and the suggested day's place. */
export function DemandMap({ centre, areas, suggestion }: { centre: LatLng; areas: MapArea[]; suggestion: (LatLng & { label: string }) | null }) {
  const corners = areas.flatMap((a) => [
    { lat: a.south, lng: a.west },
    { lat: a.north, lng: a.east },
  ]);
  return (
    <DuffMap
      label="Map of open needs by area"
      center={centre}
      zoom={12}
      areas={areas}
      markers={suggestion ? [{ id: "suggestion", lat: suggestion.lat, lng: suggestion.lng, tone: "selected", label: suggestion.label }] : []}
      fitTo={corners.length > 1 ? corners : undefined}
      className="h-96"
    />
  );
}
