"use client";
import { useState } from "react";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type LatLng } from "@/components/map/types";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";
import { usePointName } from "@/components/ui/use-point-name";
import { useUnits } from "@/components/ui/units-context";
import { fewHundred } from "@/lib/format/quantity";
import type { UnitSystem } from "@/lib/calc/units";

// Picks the exact pickup point: a place found by name (street, postcode), the device's own
// position, or a click on the map to put it on the very gate. Nobody types coordinates.

const pickupWords = (system: UnitSystem) => ({
  label: "Pickup point",
  hint: `Find the street or postcode, then click the map on the exact spot if you like. Only you see this point; everyone else sees a spot ${fewHundred(system)} away until you confirm their reservation.`,
  map: "Map: click to set the pickup point",
  placed: "The pickup point on the map",
});

export function LocationPicker({
  value,
  onChange,
  error,
  words: given,
  className = "h-72",
}: {
  value: { lat: number | null; lng: number | null };
  onChange: (p: LatLng) => void;
  error?: string;
  /** The field's label and hint, the map's label and what an existing point is called. */
  words?: ReturnType<typeof pickupWords>;
  className?: string;
}) {
  const { system } = useUnits();
  const words = given ?? pickupWords(system);
  const chosen = value.lat !== null && value.lng !== null ? { lat: value.lat, lng: value.lng } : null;
  const [label, setLabel] = useState<string | null>(chosen ? words.placed : null);
  const nameOf = usePointName();
  const round = (p: LatLng) => ({ lat: Math.round(p.lat * 1e6) / 1e6, lng: Math.round(p.lng * 1e6) / 1e6 });

  const pick = (p: ChosenPlace) => {
    setLabel(p.label);
    onChange(round(p));
  };

  return (
    <div className="flex flex-col gap-2">
      <PlaceSearch
        label={words.label}
        name="location"
        hint={words.hint}
        value={chosen && label ? { ...chosen, label } : null}
        onChange={pick}
        error={error}
      />
      <DuffMap
        center={chosen ?? DEFAULT_CENTER}
        zoom={chosen ? 16 : 13}
        label={words.map}
        markers={chosen ? [{ id: "pickup", ...chosen, tone: "origin", label: words.label }] : []}
        onClick={async (p) => {
          const point = round(p);
          onChange(point);
          setLabel(await nameOf(point, "Point on the map"));
        }}
        className={className}
      />
    </div>
  );
}
