"use client";
import { useState } from "react";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type LatLng } from "@/components/map/types";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";
import { usePointName } from "@/components/ui/use-point-name";

// Picks the exact pickup point: a place found by name (street, postcode), the device's own
// position, or a click on the map to put it on the very gate. Nobody types coordinates.

export function LocationPicker({ value, onChange, error }: { value: { lat: number | null; lng: number | null }; onChange: (p: LatLng) => void; error?: string }) {
  const chosen = value.lat !== null && value.lng !== null ? { lat: value.lat, lng: value.lng } : null;
  const [label, setLabel] = useState<string | null>(chosen ? "The pickup point on the map" : null);
  const nameOf = usePointName();
  const round = (p: LatLng) => ({ lat: Math.round(p.lat * 1e6) / 1e6, lng: Math.round(p.lng * 1e6) / 1e6 });

  const pick = (p: ChosenPlace) => {
    setLabel(p.label);
    onChange(round(p));
  };

  return (
    <div className="flex flex-col gap-2">
      <PlaceSearch
        label="Pickup point"
        name="location"
        hint="Find the street or postcode, then click the map on the exact spot if you like. Only you see this point; everyone else sees a spot a few hundred metres away until you confirm their reservation."
        value={chosen && label ? { ...chosen, label } : null}
        onChange={pick}
        error={error}
      />
      <DuffMap
        center={chosen ?? DEFAULT_CENTER}
        zoom={chosen ? 16 : 13}
        label="Map: click to set the pickup point"
        markers={chosen ? [{ id: "pickup", ...chosen, tone: "origin", label: "Pickup point" }] : []}
        onClick={async (p) => {
          const point = round(p);
          onChange(point);
          setLabel(await nameOf(point, "Point on the map"));
        }}
        className="h-72"
      />
    </div>
  );
}
