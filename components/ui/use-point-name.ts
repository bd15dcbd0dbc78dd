"use client";
import { useCallback } from "react";
import { apiFetch } from "@/lib/api/client";
import type { Place } from "@/lib/validation/places";

/** Words for a point picked on a map: "Point on the map near Mill Leat Lane, Fernhollow". */
export function usePointName() {
  return useCallback(async (p: { lat: number; lng: number }, what: string): Promise<string> => {
    try {
      const { place } = await apiFetch<{ place: Place | null }>(`/api/places/nearest?lat=${p.lat}&lng=${p.lng}`);
      return place ? `${what} near ${place.label}` : what;
    } catch {
      return what;
    }
  }, []);
}
