"use client";
import { useEffect, useMemo, useState } from "react";
import Link from "next/link";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER, type MapMarker } from "@/components/map/types";
import { Button } from "@/components/ui/button";
import { Checkbox } from "@/components/ui/choice";
import { EmptyState, Spinner } from "@/components/ui/empty-state";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Form } from "@/components/ui/form";
import type { UnitSystem } from "@/lib/calc/units";
import { fewHundred, formatQuantity } from "@/lib/format/quantity";
import type { BedStillNeeds } from "@/lib/services/beds/list-beds-still-needing";
import { ListingCard } from "./listing-card";
import { fitLine, handedLitres } from "./bed-fit";
import { AMOUNT_CHOICES, LANES, laneOf, RADIUS_CHOICES, searchString, WHEN_CHOICES, type BrowseFilters, type LaneId } from "./browse-filters";
import { MaterialLanes } from "./material-lanes";
import { useListings, type BrowsePage } from "./use-listings";

type Bed = Pick<BedStillNeeds, "id" | "name" | "point" | "needs">;

const WEEK_MS = 7 * 86_400_000;

export function BrowseView({ initial, system, beds, signedIn }: { initial: { filters: BrowseFilters; page: BrowsePage }; system: UnitSystem; beds: Bed[]; signedIn: boolean }) {
  const [filters, setFilters] = useState<BrowseFilters>(initial.filters);
  const [words, setWords] = useState(initial.filters.q);
  const [picking, setPicking] = useState(false);
  const [selected, setSelected] = useState<string | null>(null);
  const [bedId, setBedId] = useState<string | null>(null);
  const bed = beds.find((b) => b.id === bedId) ?? null;
  const query = useListings(filters, initial);
  const loaded = useMemo(() => query.data?.pages.flatMap((p) => p.items) ?? [], [query.data]);
  // How much and when are answered here, from what the page holds.
  // "Still there in a week" counts from when the page opened.
  const [weekOn] = useState(() => Date.now() + WEEK_MS);
  const items = useMemo(() => {
    const minL = AMOUNT_CHOICES.find((c) => c.id === filters.amount)?.min_l ?? 0;
    return loaded.filter(
      (i) =>
        handedLitres(i) >= minL &&
        (filters.when !== "now" || !i.reservable_from) &&
        (filters.when !== "week" || !i.available_until || new Date(i.available_until).getTime() >= weekOn),
    );
  }, [loaded, filters.amount, filters.when, weekOn]);

  // The address bar follows the filters (without a server round trip), so a search can be shared.
  useEffect(() => {
    const qs = searchString(filters, { page: true });
    window.history.replaceState(null, "", qs ? `/browse?${qs}` : "/browse");
  }, [filters]);

  const update = (change: Partial<BrowseFilters>) => {
    setSelected(null);
    setFilters((f) => ({ ...f, ...change }));
  };
  const setRadius = (value: string) =>
    value === "" ? update({ radius_km: null, point: null }) : update({ radius_km: Number(value), point: filters.point ?? bed?.point ?? DEFAULT_CENTER });
  const lane = LANES.find((l) => l.materials.length === filters.materials.length && l.materials.every((m) => filters.materials.includes(m)))?.id ?? null;
  const chooseLane = (id: LaneId | null) => update({ materials: id ? [...LANES.find((l) => l.id === id)!.materials] : [] });
  const chooseBed = (id: string | null) => {
    setBedId(id);
    const b = beds.find((x) => x.id === id);
    if (b?.point) update({ point: b.point, radius_km: filters.radius_km ?? 10 });
  };

  const stillNeeds = useMemo(() => {
    if (!bed) return undefined;
    const out: Partial<Record<LaneId, string>> = {};
    for (const n of bed.needs) {
      const l = laneOf(n.material);
      out[l] = n.quantity > 0 ? `still needed: ${formatQuantity(n.quantity, n.unit, system)}` : "your bed has enough";
    }
    return out;
  }, [bed, system]);

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
  if (filters.point) markers.push({ id: "search-point", ...filters.point, tone: "origin", label: bed?.point === filters.point ? bed.name : "Distances measured from here" });
  const chosen = items.find((i) => i.id === selected);
  const fromTown = filters.point && filters.point.lat === DEFAULT_CENTER.lat && filters.point.lng === DEFAULT_CENTER.lng;

  return (
    <div className="flex flex-col gap-4">
      <BedMode beds={beds} bedId={bedId} onChoose={chooseBed} signedIn={signedIn} />
      <MaterialLanes filters={filters} chosen={lane} onChoose={chooseLane} system={system} stillNeeds={stillNeeds} />

      <Form
        role="search"
        aria-label="Filter listings"
        className="grid gap-3 rounded-leaf bg-white p-4 ring-1 ring-humus-200 sm:grid-cols-2 lg:grid-cols-[minmax(0,1.4fr)_repeat(3,minmax(0,1fr))_auto]"
        onSubmit={(e) => {
          e.preventDefault();
          update({ q: words });
        }}
      >
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-words">Anything in particular</label>
          <input id="browse-words" type="search" value={words} onChange={(e) => setWords(e.target.value)} placeholder="oak, bales, tubs…" className={inputClass} />
        </div>
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-distance">How far</label>
          <select id="browse-distance" value={filters.radius_km ?? ""} onChange={(e) => setRadius(e.target.value)} className={inputClass}>
            <option value="">Anywhere</option>
            {RADIUS_CHOICES.map((r) => (
              <option key={r.km} value={r.km}>
                {formatQuantity(r.km, "km", system)}
                {r.how ? `, ${r.how}` : ""}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-amount">How much</label>
          <select id="browse-amount" value={filters.amount} onChange={(e) => update({ amount: e.target.value as BrowseFilters["amount"] })} className={inputClass}>
            {AMOUNT_CHOICES.map((c) => (
              <option key={c.id} value={c.id}>
                {c.min_l ? `${c.label} (${formatQuantity(c.min_l, "l", system)})` : c.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1 text-sm font-medium">
          <label htmlFor="browse-when">When I can collect</label>
          <select id="browse-when" value={filters.when} onChange={(e) => update({ when: e.target.value as BrowseFilters["when"] })} className={inputClass}>
            {WHEN_CHOICES.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-end gap-3">
          <Checkbox label="Free only" checked={filters.free} onChange={(e) => update({ free: e.target.checked })} className="whitespace-nowrap text-sm font-medium" />
          <Button type="submit" variant="secondary">
            Search
          </Button>
        </div>
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
              Try another lane, a wider distance, or any amount. New material is posted all the time, especially in autumn.
            </EmptyState>
          ) : (
            <ul className="flex flex-col gap-3">
              {items.map((item) => (
                <li key={item.id}>
                  <ListingCard
                    item={item}
                    system={system}
                    selected={item.id === selected}
                    onHover={setSelected}
                    fit={bed ? fitLine(item, bed.needs.find((n) => n.material === item.material), bed.name, system) : null}
                  />
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
              {filters.point
                ? bed?.point === filters.point
                  ? `Distances from ${bed.name}.`
                  : fromTown
                    ? "Distances from the centre of Fernhollow."
                    : "Distances from the point you chose."
                : `Points are moved ${fewHundred(system)} to keep addresses private.`}
            </span>
            <button type="button" onClick={() => setPicking((p) => !p)} aria-pressed={picking} className="min-h-11 rounded-lg px-3 font-medium ring-1 ring-humus-300 hover:bg-humus-100">
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

/** "Everything" or one of the gardener's beds, whose remaining needs each card is measured against. */
function BedMode({ beds, bedId, onChoose, signedIn }: { beds: Bed[]; bedId: string | null; onChoose: (id: string | null) => void; signedIn: boolean }) {
  if (beds.length === 0) {
    return (
      <p className="text-sm text-humus-700">
        {signedIn ? (
          <>
            <Link href="/plan" className="font-medium text-moss-700 underline underline-offset-4">
              Plan a bed
            </Link>{" "}
            and browse for it: each listing then says how much of your bed it covers.
          </>
        ) : (
          <>
            <Link href="/sign-in?callbackUrl=%2Fbrowse" className="font-medium text-moss-700 underline underline-offset-4">
              Sign in
            </Link>{" "}
            to browse for one of your beds: each listing then says how much of that bed it covers.
          </>
        )}
      </p>
    );
  }
  return (
    <fieldset className="flex flex-wrap items-center gap-x-4 gap-y-1 rounded-leaf bg-moss-50 px-4 py-2 ring-1 ring-moss-200">
      <legend className="sr-only">Browse for</legend>
      <label className="flex min-h-11 items-center gap-2 font-medium">
        <input type="radio" name="browse-for" checked={bedId === null} onChange={() => onChoose(null)} /> Everything on offer
      </label>
      <label className="flex min-h-11 items-center gap-2 font-medium">
        <input type="radio" name="browse-for" checked={bedId !== null} onChange={() => onChoose(beds[0].id)} /> For my bed
        {beds.length === 1 ? <span className="font-normal text-humus-700">({beds[0].name})</span> : null}
      </label>
      {bedId !== null && beds.length > 1 ? (
        <label className="flex items-center gap-2 text-sm font-medium">
          Which bed
          <select value={bedId} onChange={(e) => onChoose(e.target.value)} className={inputClass}>
            {beds.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </select>
        </label>
      ) : null}
    </fieldset>
  );
}
