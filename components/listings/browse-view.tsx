"use client";
import { useEffect, useMemo, useState } from "react";
import Link from "next/link";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type MapMarker } from "@/components/map/types";
import { Button } from "@/components/ui/button";
import { EmptyState, Spinner } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { MATERIAL_CODES, MATERIALS } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { ListingCard } from "./listing-card";
import { RADIUS_CHOICES, searchString, type BrowseFilters } from "./browse-filters";
import { useListings, type BrowsePage } from "./use-listings";
import { Form } from "@/components/ui/form";
import { fewHundred, formatQuantity } from "@/lib/format/quantity";

const control = "min-h-11 rounded-lg border border-humus-300 bg-white px-3";

export function BrowseView({ initial, system }: { initial: { filters: BrowseFilters; page: BrowsePage }; system: UnitSystem }) {
  const [filters, setFilters] = useState<BrowseFilters>(initial.filters);
  const [words, setWords] = useState(initial.filters.q);
  const [picking, setPicking] = useState(false);
  const [selected, setSelected] = useState<string | null>(null);
  const query = useListings(filters, initial);
  const items = useMemo(() => query.data?.pages.flatMap((p) => p.items) ?? [], [query.data]);

  // The address bar follows the filters (without a server round trip), so a search can be shared.
  useEffect(() => {
    const qs = searchString(filters);
    window.history.replaceState(null, "", qs ? `/browse?${qs}` : "/browse");
  }, [filters]);

  const update = (change: Partial<BrowseFilters>) => {
    setSelected(null);
    setFilters((f) => ({ ...f, ...change }));
  };
  const setRadius = (value: string) =>
    value === "" ? update({ radius_km: null, point: null }) : update({ radius_km: Number(value), point: filters.point ?? DEFAULT_CENTER });

  const markers: MapMarker[] = items.map((i) => ({
    id: i.id,
    lat: i.location.lat,
    lng: i.location.lng,
    label: i.title,
    tone: i.id === selected ? "selected" : "listing",
    className: `listing-marker listing-marker-${i.id}`,
    onSelect: () => {
      setSelected(i.id);
      document.getElementById(`listing-${i.id}`)?.scrollIntoView({ block: "nearest", behavior: "smooth" });
    },
  }));
  if (filters.point) markers.push({ id: "search-point", ...filters.point, tone: "origin", label: "Distances measured from here" });
  const chosen = items.find((i) => i.id === selected);
  const fromTown = filters.point && filters.point.lat === DEFAULT_CENTER.lat && filters.point.lng === DEFAULT_CENTER.lng;

  return (
    <div className="flex flex-col gap-4">
      <Form
        role="search"
        aria-label="Filter listings"
        className="flex flex-wrap items-end gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200"
        onSubmit={(e) => {
          e.preventDefault();
          update({ q: words });
        }}
      >
        <div className="flex min-w-48 flex-1 flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-words">Words</label>
          <input id="browse-words" type="search" value={words} onChange={(e) => setWords(e.target.value)} placeholder="oak, bales, tubs…" className={control} />
        </div>
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-material">Material</label>
          <select id="browse-material" value={filters.material} onChange={(e) => update({ material: e.target.value as BrowseFilters["material"] })} className={control}>
            <option value="">Any material</option>
            {MATERIAL_CODES.map((m) => (
              <option key={m} value={m}>
                {MATERIALS[m].name}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-distance">Distance</label>
          <select id="browse-distance" value={filters.radius_km ?? ""} onChange={(e) => setRadius(e.target.value)} className={control}>
            <option value="">Anywhere</option>
            {RADIUS_CHOICES.map((r) => (
              <option key={r} value={r}>
                Within {formatQuantity(r, "km", system)}
              </option>
            ))}
          </select>
        </div>
        <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
          <input type="checkbox" checked={filters.free} onChange={(e) => update({ free: e.target.checked })} className="h-5 w-5" /> Free only
        </label>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </Form>

      <div className="grid gap-4 md:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <section aria-labelledby="results-title" className="order-2 flex flex-col gap-3 md:order-1">
          <h2 id="results-title" className="text-lg font-semibold">
            {query.isPending ? "Looking…" : `${items.length}${query.hasNextPage ? "+" : ""} listing${items.length === 1 ? "" : "s"}`}
            <span className="ml-2 text-sm font-normal text-humus-600">{filters.point ? "nearest first" : "newest first"}</span>
          </h2>
          {query.isError ? (
            <Notice tone="error" title="The listings could not be loaded">
              {query.error.message}{" "}
              <button type="button" className="underline" onClick={() => void query.refetch()}>
                Try again
              </button>
            </Notice>
          ) : query.isPending ? (
            <Spinner label="Loading listings" />
          ) : items.length === 0 ? (
            <EmptyState title="Nothing matches yet">
              Try fewer words, another material or a wider distance. New material is posted all the time, especially in autumn.
            </EmptyState>
          ) : (
            <ul className="flex flex-col gap-3">
              {items.map((item) => (
                <li key={item.id}>
                  <ListingCard item={item} system={system} selected={item.id === selected} onHover={setSelected} />
                </li>
              ))}
            </ul>
          )}
          {query.hasNextPage ? (
            <Button variant="secondary" onClick={() => void query.fetchNextPage()} disabled={query.isFetchingNextPage}>
              {query.isFetchingNextPage ? "Loading…" : "Show more"}
            </Button>
          ) : null}
        </section>

        <section aria-label="Map of results" className="order-1 flex flex-col gap-2 md:sticky md:top-4 md:order-2 md:self-start">
          <DuffMap
            center={filters.point ?? DEFAULT_CENTER}
            zoom={12}
            markers={markers}
            fitTo={markers.length ? markers : undefined}
            label="Map of the listings shown; points are approximate"
            className="h-72 md:h-[32rem]"
            onClick={
              picking
                ? (p) => {
                    setPicking(false);
                    update({ point: { lat: Math.round(p.lat * 1e5) / 1e5, lng: Math.round(p.lng * 1e5) / 1e5 }, radius_km: filters.radius_km ?? 10 });
                  }
                : undefined
            }
          />
          <div className="flex flex-wrap items-center gap-3 text-sm text-humus-700">
            <span>
              {filters.point ? (fromTown ? "Distances from the centre of Fernhollow." : "Distances from the point you chose.") : `Points are moved ${fewHundred(system)} to keep addresses private.`}
            </span>
            <button type="button" onClick={() => setPicking((p) => !p)} aria-pressed={picking} className="rounded-lg px-3 py-1.5 font-medium ring-1 ring-humus-300 hover:bg-humus-100">
              {picking ? "Click the map…" : "Measure from a point on the map"}
            </button>
          </div>
          {chosen ? (
            <div className="rounded-lg bg-white p-3 text-sm ring-1 ring-litter-500" aria-live="polite">
              <p className="font-semibold">{chosen.title}</p>
              <Link href={`/listings/${chosen.id}`} className="text-moss-700 underline">
                Open this listing
              </Link>
            </div>
          ) : null}
        </section>
      </div>
    </div>
  );
}
