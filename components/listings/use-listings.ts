"use client";
import { useInfiniteQuery, type InfiniteData } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api/client";
import type { CardItem } from "./listing-card";
import { BROWSE_PAGE, searchString, type BrowseFilters } from "./browse-filters";

export interface BrowsePage {
  items: (CardItem & { location: { lat: number; lng: number } })[];
  next_cursor: string | null;
}

/** Browse results page by page; the first page of the search the server rendered is reused, not refetched. */
export function useListings(filters: BrowseFilters, initial?: { filters: BrowseFilters; page: BrowsePage }) {
  const key = searchString(filters);
  const seeded = initial && searchString(initial.filters) === key;
  return useInfiniteQuery({
    queryKey: ["listings", key],
    queryFn: ({ pageParam, signal }) => apiFetch<BrowsePage>(`/api/listings?${searchString(filters, { cursor: pageParam, limit: BROWSE_PAGE })}`, { signal }),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.next_cursor,
    initialData: seeded ? ({ pages: [initial.page], pageParams: [null] } satisfies InfiniteData<BrowsePage, string | null>) : undefined,
  });
}
