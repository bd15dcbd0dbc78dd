"use client";
import Link from "next/link";
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_datetime,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useMemo } from "react";
import type { ListingStatus } from "@/lib/listings/status";
import type { UnitSystem, ListingUnit } from "@/lib/calc/units";
import { formatListingQuantity, materialName, STATUS_LABELS } from "@/lib/listings/format";
import { StatusActions } from "./status-actions";
import { StatusBadge } from "./status-badge";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { DataTable } from "@/components/ui/data-table";
import { inputClass } from "@/components/ui/field";

export interface MineRow {
  id: string;
  title: string;
  material: string;
  status: ListingStatus;
  unit: ListingUnit;
  left: number;
  total: number;
  held: number;
  updated_at: string;
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, datetime: sortFn_datetime },
  filterFns: { includesString: filterFn_includesString },
});
const helper = createColumnHelper<typeof features, MineRow & { search: string }>();

function columnsFor(system: UnitSystem) {
  return helper.columns([
    // Filtering and sorting read the title with its material and status words; the cell shows the title.
    helper.accessor((r) => r.search, {
      id: "title",
      header: "Listing",
      cell: (c) => (
        <div className="flex flex-col">
          <Link href={`/listings/${c.row.original.id}`} className="font-medium hover:underline">
            {c.row.original.title}
          </Link>
          <span className="text-xs text-humus-600">{materialName(c.row.original.material)}</span>
        </div>
      ),
    }),
    helper.accessor("status", { header: "Status", cell: (c) => <StatusBadge status={c.getValue()} /> }),
    helper.accessor("left", {
      header: "Left",
      cell: (c) => (
        <div className="flex flex-col">
          <span>{formatListingQuantity(c.getValue(), c.row.original.unit, system)}</span>
          <span className="text-xs text-humus-600">of {formatListingQuantity(c.row.original.total, c.row.original.unit, system)}</span>
        </div>
      ),
    }),
    helper.accessor("held", { header: "On hold", cell: (c) => formatListingQuantity(c.getValue(), c.row.original.unit, system) }),
    helper.accessor("updated_at", {
      header: "Changed",
      sortFn: "datetime",
      cell: (c) => formatLocal(c.getValue()),
    }),
    helper.display({
      id: "actions",
      header: "Actions",
      cell: (c) => (
        <div className="flex flex-wrap items-start gap-2">
          {c.row.original.status !== "archived" && c.row.original.status !== "hidden" ? (
            <Link href={`/listings/${c.row.original.id}/edit`} className="inline-flex min-h-9 items-center rounded-lg px-3 py-1.5 text-sm font-medium ring-1 ring-humus-300 hover:bg-humus-100" aria-label={`Edit “${c.row.original.title}”`}>
              Edit
            </Link>
          ) : null}
          <StatusActions id={c.row.original.id} status={c.row.original.status} title={c.row.original.title} compact />
        </div>
      ),
    }),
  ]);
}

/** The owner's listings: sortable by any column, filtered by words in the title, material or status. */
export function MineTable({ rows, system }: { rows: MineRow[]; system: UnitSystem }) {
  // Rows change when the page refreshes after a status change; memoised so the table keeps its models otherwise.
  const data = useMemo(() => rows.map((r) => ({ ...r, search: `${r.title} ${materialName(r.material)} ${STATUS_LABELS[r.status]}` })), [rows]);
  const columns = useMemo(() => columnsFor(system), [system]);
  const table = useTable({
    features,
    columns,
    data,
    globalFilterFn: "includesString",
    getColumnCanGlobalFilter: (column) => column.id === "title",
    initialState: { sorting: [{ id: "updated_at", desc: true }] },
  });
  return (
    <div className="flex flex-col gap-3">
      <label className="flex max-w-sm flex-col gap-1 text-sm font-medium">
        Filter
        <input
          type="search"
          value={String(table.state.globalFilter ?? "")}
          onChange={(e) => table.setGlobalFilter(e.target.value)}
          placeholder="Title, material or status"
          className={inputClass}
        />
      </label>
      <DataTable
        table={table}
        caption="My listings; select a column heading to sort"
        empty="No listing matches that filter."
        unsortable={["actions"]}
        rowProps={(r) => ({ "data-listing-id": r.id })}
        stack={{ unlabelled: ["title"] }}
      />
    </div>
  );
}
