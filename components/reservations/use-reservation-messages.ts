"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api/client";

export interface ThreadMessage {
  id: string;
  body: string;
  created_at: string;
  author: { id: string; name: string };
  side: "gardener" | "supplier";
  mine: boolean;
}

const key = (id: string) => ["reservation-messages", id] as const;

export function useReservationMessages(id: string) {
  return useQuery({
    queryKey: key(id),
    queryFn: ({ signal }) => apiFetch<{ messages: ThreadMessage[] }>(`/api/reservations/${id}/messages`, { signal }).then((r) => r.messages),
    refetchInterval: 30_000,
  });
}

export function useSendReservationMessage(id: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: string) => apiFetch<{ message: ThreadMessage }>(`/api/reservations/${id}/messages`, { method: "POST", body: { body } }),
    onSuccess: () => client.invalidateQueries({ queryKey: key(id) }),
  });
}
