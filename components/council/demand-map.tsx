"use client";
import { DuffMap } from "@/components/map/map";
import type { LatLng, MapArea } from "@/components/map/types";

/** The council's demand map: shaded cells (each from at least three people) and the suggested day's place, with a key. */
export function DemandMap({ centre, areas, suggestion, minPeople }: { centre: LatLng; areas: MapArea[]; suggestion: (LatLng & { label: string }) | null; minPeople: number }) {
  const corners = areas.flatMap((a) => [
    { lat: a.south, lng: a.west },
    { lat: a.north, lng: a.east },
  ]);
  return (
    <figure className="flex flex-col gap-2">
      <DuffMap
        label="Map of open needs by area"
        center={centre}
        zoom={12}
        areas={areas}
        markers={suggestion ? [{ id: "suggestion", lat: suggestion.lat, lng: suggestion.lng, tone: "selected", label: suggestion.label }] : []}
        fitTo={corners.length > 1 ? corners : undefined}
        className="h-96"
      />
      <figcaption className="flex flex-wrap gap-x-5 gap-y-1 text-sm text-humus-700" data-map-key>
        <span className="flex items-center gap-2">
          <span aria-hidden className="inline-block h-3.5 w-3.5 border border-litter-700 bg-litter-500/70" />
          An area where {minPeople} or more people need it (darker: more people)
        </span>
        {suggestion ? (
          <span className="flex items-center gap-2">
            <span aria-hidden className="inline-block h-3.5 w-3.5 rounded-full border-[3px] border-litter-700 bg-litter-300" />
            The suggested giveaway spot
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}
