"use client";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type LatLng } from "@/components/map/types";

/** Approximate points of giveaway days (or the exact one, for a booked household or staff). */
export function GiveawayMap({ points, label = "Map of giveaway days (approximate places)", className = "h-80 lg:sticky lg:top-4" }: { points: (LatLng & { id: string; label: string })[]; label?: string; className?: string }) {
  return (
    <DuffMap
      label={label}
      center={points[0] ?? DEFAULT_CENTER}
      zoom={13}
      markers={points.map((p) => ({ ...p, tone: "listing" as const }))}
      fitTo={points.length > 1 ? points : undefined}
      className={className}
    />
  );
}
