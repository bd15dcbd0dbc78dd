"use client";
import { useMutation, useQuery } from "@tanstack/react-query";
import { apiFetch, submitOnce } from "@/lib/api/client";
import { useSubmitKeys } from "@/components/ui/use-submit-keys";
import type { PickupPlanResponse } from "@/lib/services/match/plan-pickups";
import type { MatchRequest } from "@/lib/validation/match";

export type PickupPlan = PickupPlanResponse;

/** The pickup plan for a request; nothing is asked until there is one. */
export function useMatch(request: MatchRequest | null) {
  return useQuery({
    queryKey: ["match", request],
    queryFn: ({ signal }) => apiFetch<PickupPlan>("/api/match", { body: request, signal }),
    enabled: request !== null,
    retry: false,
    staleTime: 60_000,
  });
}

/** One stop of a plan as the reservation flow takes it: its pickup time, or a parcel's address. */
export interface ReserveAllItem {
  listing_id: string;
  quantity: number;
  pickup_window_id?: string | null;
  fulfilment?: "pickup" | "post";
  ship_to?: string | null;
}

export interface ReserveAllBody {
  items: ReserveAllItem[];
  bed_id?: string;
}

/** What the reservation flow answers; a priced or deposit listing needs the payment page next. */
export interface ReserveAllAnswer {
  reservations: { id: string }[];
  checkout_url?: string;
}

/** Hands a plan's allocations to the reservation flow (all or nothing). */
export function useReserveAll() {
  const keys = useSubmitKeys();
  return useMutation({ mutationFn: (body: ReserveAllBody) => submitOnce<ReserveAllAnswer>(keys, "/api/reservations", { body }) });
}
