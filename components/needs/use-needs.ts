"use client";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api/client";
import type { NeedView } from "@/lib/needs/view";

/** A bed's open needs (to show which unmet materials are already being watched for). */
export function useBedNeeds(bedId: string | undefined) {
  return useQuery({
    queryKey: ["needs", "bed", bedId],
    queryFn: ({ signal }) => apiFetch<{ needs: NeedView[] }>(`/api/needs?status=open&bed_id=${encodeURIComponent(bedId!)}`, { signal }).then((r) => r.needs),
    enabled: !!bedId,
    staleTime: 30_000,
  });
}

/** After a need is opened: the bed's list is read again. */
export function useNeedsChanged() {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: ["needs"] });
}
