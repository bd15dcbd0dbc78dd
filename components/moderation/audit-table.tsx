"use client";
import { DataTable } from "@/components/ui/data-table";
import { useMemo, useState } from "react";
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_equalsString,
  filterFn_includesString,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";

export interface AuditItem {
  id: number;
  created_at: string;
  actor_name: string | null;
  actor_email: string | null;
  action: string;
  subject_type: string;
  subject_id: string | null;
  before: string | null;
  after: string | null;
}

const features = tableFeatures({
  columnFilteringFeature,
  rowSortingFeature,
  rowPaginationFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  paginatedRowModel: createPaginatedRowModel(),
  filterFns: { includesString: filterFn_includesString, equalsString: filterFn_equalsString },
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
});

const helper = createColumnHelper<typeof features, AuditItem>();
const columns = helper.columns([
  helper.accessor("id", { header: "#", sortFn: "basic", enableColumnFilter: false }),
  helper.accessor("created_at", {
    header: "When",
    sortFn: "alphanumeric",
    filterFn: "includesString",
    cell: (c) => new Date(c.getValue()).toLocaleString("en-GB", { timeZone: "Europe/London" }),
  }),
  helper.accessor((r) => `${r.actor_name ?? "system"} ${r.actor_email ?? ""}`.trim(), { id: "who", header: "Who", filterFn: "includesString", sortFn: "alphanumeric" }),
  helper.accessor("action", { header: "What", filterFn: "includesString", sortFn: "alphanumeric" }),
  helper.accessor("subject_type", { header: "On", filterFn: "equalsString", sortFn: "alphanumeric" }),
  helper.accessor((r) => r.subject_id ?? "", { id: "subject_id", header: "Which", filterFn: "includesString", sortFn: "alphanumeric" }),
  helper.accessor((r) => r.before ?? "", { id: "before", header: "Before", filterFn: "includesString", enableSorting: false, cell: (c) => <Json text={c.getValue()} /> }),
  helper.accessor((r) => r.after ?? "", { id: "after", header: "After", filterFn: "includesString", enableSorting: false, cell: (c) => <Json text={c.getValue()} /> }),
]);

function Json({ text }: { text: string }) {
  if (!text) return <span className="text-humus-500">—</span>;
  return (
    <details>
      <summary className="max-w-[16rem] cursor-pointer truncate font-mono text-xs">{text}</summary>
      <pre className="max-w-md overflow-x-auto whitespace-pre-wrap break-all font-mono text-xs">{JSON.stringify(JSON.parse(text), null, 2)}</pre>
    </details>
  );
}

/** The audit log, newest first, filterable by who, what, on what and the values before and after. */
export function AuditTable({ items }: { items: AuditItem[] }) {
  const [data] = useState(items);
  const subjectTypes = useMemo(() => [...new Set(items.map((i) => i.subject_type))].sort(), [items]);
  const table = useTable({
    features,
    columns,
    data,
    getRowId: (r) => String(r.id),
    initialState: { sorting: [{ id: "id", desc: true }], pagination: { pageIndex: 0, pageSize: 50 } },
  });
  const filter = (id: string) => table.getColumn(id)!;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200 sm:grid-cols-2 lg:grid-cols-4" role="search" aria-label="Filter the audit log">
        <TextFilter label="Who" value={(filter("who").getFilterValue() as string) ?? ""} onChange={(v) => filter("who").setFilterValue(v || undefined)} />
        <TextFilter label="Action" hint="e.g. listing.hide, giveaway." value={(filter("action").getFilterValue() as string) ?? ""} onChange={(v) => filter("action").setFilterValue(v || undefined)} />
        <div className="flex flex-col gap-1">
          <label htmlFor="audit-on" className="text-sm font-medium">
            On
          </label>
          <select id="audit-on" className="min-h-11 rounded-lg border border-humus-300 bg-white px-3" value={(filter("subject_type").getFilterValue() as string) ?? ""} onChange={(e) => filter("subject_type").setFilterValue(e.target.value || undefined)}>
            <option value="">anything</option>
            {subjectTypes.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </select>
        </div>
        <TextFilter label="Which (id)" value={(filter("subject_id").getFilterValue() as string) ?? ""} onChange={(v) => filter("subject_id").setFilterValue(v || undefined)} />
      </div>
      <p aria-live="polite" className="text-sm text-humus-700">
        {table.getFilteredRowModel().rows.length} of {items.length} entries
      </p>
      <DataTable table={table} caption="Audit log" empty="Nothing matches these filters." dense rowProps={(r) => ({ "data-action": r.action })} />
      <div className="flex items-center gap-3">
        <button type="button" className="min-h-11 rounded-lg px-3 ring-1 ring-humus-300 disabled:opacity-50" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          Newer
        </button>
        <span className="text-sm">
          Page {table.state.pagination.pageIndex + 1} of {Math.max(1, table.getPageCount())}
        </span>
        <button type="button" className="min-h-11 rounded-lg px-3 ring-1 ring-humus-300 disabled:opacity-50" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Older
        </button>
      </div>
    </div>
  );
}

function TextFilter({ label, value, onChange, hint }: { label: string; value: string; onChange: (v: string) => void; hint?: string }) {
  const id = `audit-${label.toLowerCase().replace(/\W+/g, "-")}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <input id={id} type="search" value={value} placeholder={hint} onChange={(e) => onChange(e.target.value)} className="min-h-11 rounded-lg border border-humus-300 bg-white px-3" />
    </div>
  );
}
