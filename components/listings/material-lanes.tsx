"use client";
import { useQueries } from "@tanstack/react-query";
import type { MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { apiFetch } from "@/lib/api/client";
import { formatDistance, formatQuantity } from "@/lib/format/quantity";
import { needPerListingUnit, NEED_UNITS } from "@/lib/match/units";
import type { NeedUnit } from "@/lib/match/types";
import { MATERIAL_COLOURS } from "@/components/ui/palette";
import { GlyphShape } from "./unit-drawing";
import { LANES, searchString, type BrowseFilters, type LaneId } from "./browse-filters";
import type { BrowsePage } from "./use-listings";

const LANE_GLYPH = { cardboard: "sheet", leaves: "bag", straw: "bale", worms: "tub", extras: "heap" } as const;
const LANE_LIMIT = 100;

interface LaneSummary {
  count: string;
  nearest: number | null;
  amount: string | null;
}

function summarise(page: BrowsePage | undefined, lane: (typeof LANES)[number], system: UnitSystem): LaneSummary | null {
  if (!page) return null;
  const unit: NeedUnit = NEED_UNITS[lane.materials[0] as MaterialCode][0];
  let total = 0;
  for (const i of page.items) {
    const per = needPerListingUnit({ material: i.material, unit: i.unit, unit_size: i.unit_size ?? null, unit_mass_kg: i.unit_mass_kg ?? null }, unit);
    if (per) total += per * i.quantity_available;
  }
  const distances = page.items.map((i) => i.distance_km).filter((d): d is number => d !== null);
  return {
    count: `${page.items.length}${page.next_cursor ? "+" : ""}`,
    nearest: distances.length ? Math.min(...distances) : null,
    amount: total > 0 ? formatQuantity(total, unit, system) : null,
  };
}

/**
 * The lanes across the top of browse: for each kind of material, how much is on offer within
 * the chosen distance and how near the nearest is. Choosing a lane filters the list to it.
 */
export function MaterialLanes({ filters, chosen, onChoose, system, stillNeeds }: { filters: BrowseFilters; chosen: LaneId | null; onChoose: (lane: LaneId | null) => void; system: UnitSystem; stillNeeds?: Partial<Record<LaneId, string>> }) {
  const results = useQueries({
    queries: LANES.map((lane) => {
      const qs = searchString({ ...filters, materials: [...lane.materials] }, { limit: LANE_LIMIT });
      return { queryKey: ["lane", qs], queryFn: ({ signal }: { signal: AbortSignal }) => apiFetch<BrowsePage>(`/api/listings?${qs}`, { signal }) };
    }),
  });
  return (
    <nav aria-label="Materials" className="-mx-4 overflow-x-auto px-4 py-1">
      <ul className="grid min-w-[44rem] grid-cols-5 gap-2">
        {LANES.map((lane, i) => {
          const s = summarise(results[i].data, lane, system);
          const on = chosen === lane.id;
          const colour = MATERIAL_COLOURS[lane.materials[0]];
          return (
            <li key={lane.id}>
              <button
                type="button"
                aria-pressed={on}
                onClick={() => onChoose(on ? null : lane.id)}
                className={`flex h-full w-full flex-col items-start gap-1 rounded-leaf p-3 text-left ring-1 transition ${on ? "bg-moss-50 ring-2 ring-moss-600" : "bg-white ring-humus-200 hover:bg-humus-100"}`}
              >
                <span className="flex items-center gap-2 font-semibold">
                  <svg viewBox="0 0 20 24" className="h-6 w-5" aria-hidden="true">
                    <GlyphShape glyph={LANE_GLYPH[lane.id]} fill={colour} />
                  </svg>
                  {lane.name}
                </span>
                <span className="text-sm text-humus-700" data-testid={`lane-${lane.id}`}>
                  {results[i].isPending ? "Counting…" : !s || s.count === "0" ? "none on offer" : `${s.count} on offer${s.amount ? `, about ${s.amount}` : ""}`}
                </span>
                {s && s.nearest !== null ? <span className="text-sm text-humus-700">nearest {formatDistance(s.nearest, system)}</span> : null}
                {stillNeeds?.[lane.id] ? <span className="text-sm font-semibold text-moss-800">{stillNeeds[lane.id]}</span> : null}
              </button>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
