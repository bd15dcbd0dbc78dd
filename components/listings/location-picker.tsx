"use client";
import { useState } from "react";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type LatLng } from "@/components/map/types";
import { GroupError } from "@/components/ui/field";

// Picks the exact pickup point: a click on the map, the device's own position, or typed
// coordinates (for keyboards and screen readers, where a map click is no use).

/** The words around the map; the listing form's pickup point by default. */
export interface PickerWords {
  id: string;
  label: string;
  help: string;
  mapLabel: string;
  marker: string;
}

const PICKUP_WORDS: PickerWords = {
  id: "pickup-point",
  label: "Pickup point",
  help: "Click where people collect. Only you see this exact point; everyone else sees a spot a few hundred metres away until you confirm their reservation.",
  mapLabel: "Map: click to set the pickup point",
  marker: "Pickup point",
};

export function LocationPicker({
  value,
  onChange,
  error,
  words = PICKUP_WORDS,
  className = "h-72",
}: {
  value: { lat: number | null; lng: number | null };
  onChange: (p: LatLng) => void;
  error?: string;
  words?: PickerWords;
  className?: string;
}) {
  const [status, setStatus] = useState<string | null>(null);
  const chosen = value.lat !== null && value.lng !== null ? { lat: value.lat, lng: value.lng } : null;
  const round = (p: LatLng) => ({ lat: Math.round(p.lat * 1e6) / 1e6, lng: Math.round(p.lng * 1e6) / 1e6 });

  function useMyPosition() {
    if (!navigator.geolocation) return setStatus("This browser cannot tell where you are; click the map instead.");
    setStatus("Finding you…");
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        onChange(round({ lat: pos.coords.latitude, lng: pos.coords.longitude }));
        setStatus(null);
      },
      () => setStatus("Your position is not available; click the map instead."),
      { timeout: 10_000 },
    );
  }

  return (
    <div className="flex flex-col gap-2">
      <p className="font-medium" id={`${words.id}-label`}>
        {words.label}
      </p>
      <p className="text-sm text-humus-600">{words.help}</p>
      <DuffMap
        center={chosen ?? DEFAULT_CENTER}
        zoom={chosen ? 15 : 13}
        label={words.mapLabel}
        markers={chosen ? [{ id: "pickup", ...chosen, tone: "origin", label: words.marker }] : []}
        onClick={(p) => onChange(round(p))}
        className={className}
      />
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <button type="button" onClick={useMyPosition} className="rounded-lg px-3 py-2 font-medium ring-1 ring-humus-300 hover:bg-humus-100">
          Use where I am now
        </button>
        <span aria-live="polite">{status ?? (chosen ? `Set: ${chosen.lat.toFixed(5)}, ${chosen.lng.toFixed(5)}` : "Not set yet")}</span>
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-moss-700">Type the coordinates instead</summary>
        <div className="mt-2 flex flex-wrap gap-3">
          {(["lat", "lng"] as const).map((k) => (
            <label key={k} className="flex items-center gap-2">
              {k === "lat" ? "Latitude" : "Longitude"}
              <input
                type="number"
                step="any"
                className="min-h-11 w-36 rounded-lg border border-humus-300 bg-white px-3"
                value={value[k] ?? ""}
                onChange={(e) => {
                  const n = e.target.value === "" ? NaN : Number(e.target.value);
                  if (Number.isFinite(n)) onChange({ lat: value.lat ?? DEFAULT_CENTER.lat, lng: value.lng ?? DEFAULT_CENTER.lng, [k]: n } as LatLng);
                }}
              />
            </label>
          ))}
        </div>
      </details>
      <GroupError id={`${words.id}-error`} error={error} />
    </div>
  );
}
