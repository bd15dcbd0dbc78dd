"use client";
import { useQuery } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { apiFetch } from "@/lib/api/client";
import type { MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun } from "@/lib/match/format";
import type { NearbyDemand } from "@/lib/services/needs/nearby-demand";
import { Spinner } from "@/components/ui/empty-state";

/** The point, once it has stopped moving for a moment (a pin dragged about asks once). */
function useSettled<T>(value: T, ms = 400): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

const needsWord = (n: number) => `${n} open ${n === 1 ? "need" : "needs"}`;

/**
 * Before publishing: how many gardeners' open needs a listing of this material here would
 * serve, in rounded, anonymous figures from the server (GET /api/needs/nearby-demand).
 */
export function DemandPreview({ material, location, system }: { material: MaterialCode; location: { lat: number | null; lng: number | null }; system: UnitSystem }) {
  const point = useSettled(location.lat !== null && location.lng !== null ? `${location.lat},${location.lng}` : null);
  const query = useQuery({
    queryKey: ["nearby-demand", material, point],
    queryFn: ({ signal }) => {
      const [lat, lng] = point!.split(",");
      return apiFetch<NearbyDemand>(`/api/needs/nearby-demand?${new URLSearchParams({ lat, lng, material })}`, { signal });
    },
    enabled: point !== null,
    staleTime: 60_000,
    retry: false,
  });
  return (
    <section aria-labelledby="demand-title" className="rounded-lg bg-moss-50 p-4 ring-1 ring-moss-200" data-demand-preview>
      <h3 id="demand-title" className="font-semibold">
        Gardeners waiting for {materialNoun(material)} near here
      </h3>
      {point === null ? (
        <p className="text-sm text-humus-700">Set the pickup point to see how many open needs this would serve.</p>
      ) : query.isPending ? (
        <Spinner label="Counting open needs" />
      ) : query.isError ? (
        <p className="text-sm text-humus-700">{(query.error as Error).message}</p>
      ) : (
        <>
          <ul className="mt-1 flex flex-col gap-0.5">
            {query.data.rings.map((r) => (
              <li key={r.radius_km} data-ring={r.radius_km}>
                Within {formatQuantity(r.radius_km, "km", system)}: serves {needsWord(r.needs)}
                {r.needs > 0 && r.quantity !== null ? `, about ${formatQuantity(r.quantity, r.unit, system)} in all` : ""}
              </li>
            ))}
          </ul>
          <p className="mt-2 text-sm text-humus-600">
            Counted for the area around the point, never for one household; amounts show once at least {query.data.min_people} gardeners make them up. Once published, each of them is told.
          </p>
        </>
      )}
    </section>
  );
}
