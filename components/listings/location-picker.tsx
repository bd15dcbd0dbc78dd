"use client";
import { useState } from "react";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type LatLng } from "@/components/map/types";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";
import { usePointName } from "@/components/ui/use-point-name";
import { useUnits } from "@/components/ui/units-context";
import { fewHundred } from "@/lib/format/quantity";
import type { UnitSystem } from "@/lib/calc/units";
import { inputClass } from "@/components/ui/field";

// Picks an exact point: a place found by name (street, postcode), the device's own position, or
// a click on the map to put it on the very gate. Coordinates can still be typed, tucked away,
// for a farm gate no name reaches (a phone's map app gives them).

/** The field's label and hint, the map's label and what an existing point is called. */
export interface PickerWords {
  label: string;
  hint: string;
  map: string;
  placed: string;
  /** The search field's name (its id is `field-${name}`); "location" by default. */
  name?: string;
}

const pickupWords = (system: UnitSystem): PickerWords => ({
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
  words?: PickerWords;
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
  const placeAt = async (p: LatLng) => {
    const point = round(p);
    onChange(point);
    setLabel(await nameOf(point, "Point on the map"));
  };

  return (
    <div className="flex flex-col gap-2">
      <PlaceSearch label={words.label} name={words.name ?? "location"} hint={words.hint} value={chosen && label ? { ...chosen, label } : null} onChange={pick} error={error} />
      <DuffMap
        center={chosen ?? DEFAULT_CENTER}
        zoom={chosen ? 16 : 13}
        label={words.map}
        markers={chosen ? [{ id: "pickup", ...chosen, tone: "origin", label: words.label }] : []}
        onClick={placeAt}
        className={className}
      />
      <details className="text-sm">
        <summary className="cursor-pointer text-moss-700">Type the coordinates instead</summary>
        <div className="mt-2 flex flex-wrap gap-3">
          {(["lat", "lng"] as const).map((k) => (
            <label key={k} className="flex items-center gap-2">
              {k === "lat" ? "Latitude" : "Longitude"}
              <input
                type="number"
                step="any"
                className={`${inputClass} w-36`}
                value={value[k] ?? ""}
                onChange={(e) => {
                  const n = e.target.value === "" ? NaN : Number(e.target.value);
                  if (Number.isFinite(n)) void placeAt({ lat: value.lat ?? DEFAULT_CENTER.lat, lng: value.lng ?? DEFAULT_CENTER.lng, [k]: n } as LatLng);
                }}
              />
            </label>
          ))}
        </div>
      </details>
    </div>
  );
}
