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
import { auditSentence, changeLines, subjectWords } from "@/lib/moderation/audit-words";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { inputClass } from "@/components/ui/field";

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
  subject_name?: string | null;
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
  helper.accessor("created_at", {
    header: "When",
    sortFn: "alphanumeric",
    filterFn: "includesString",
    cell: (c) => formatLocal(c.getValue()),
  }),
  helper.accessor((r) => `${r.actor_name ?? "Duffbank"} ${r.actor_email ?? ""}`.trim(), {
    id: "who",
    header: "Who",
    filterFn: "includesString",
    sortFn: "alphanumeric",
    cell: (c) => (
      <span className="flex flex-col">
        <span>{c.row.original.actor_name ?? "Duffbank"}</span>
        {c.row.original.actor_email ? <span className="text-xs text-humus-700">{c.row.original.actor_email}</span> : null}
      </span>
    ),
  }),
  helper.accessor((r) => auditSentence(r), { id: "what", header: "What happened", filterFn: "includesString", sortFn: "alphanumeric" }),
  helper.accessor("subject_type", { header: "On", filterFn: "equalsString", sortFn: "alphanumeric", cell: (c) => subjectWords({ subject_type: c.getValue(), subject_name: null }) }),
  helper.display({ id: "details", header: "Details", cell: (c) => <Details item={c.row.original} /> }),
]);

/** The values before and after, as "field: value" lines, behind a toggle; the stored codes for those who need them. */
function Details({ item }: { item: AuditItem }) {
  const before = changeLines(item.before);
  const after = changeLines(item.after);
  return (
    <details>
      <summary className="cursor-pointer text-moss-700 underline underline-offset-2">Details</summary>
      <div className="mt-2 flex max-w-md flex-col gap-2 text-xs">
        {before.length ? <Lines title="Before" lines={before} /> : null}
        {after.length ? <Lines title="After" lines={after} /> : null}
        <p className="text-humus-700">
          Entry {item.id} · {item.action} · {item.subject_type} {item.subject_id ?? ""}
        </p>
      </div>
    </details>
  );
}

function Lines({ title, lines }: { title: string; lines: { field: string; value: string }[] }) {
  return (
    <div>
      <p className="font-semibold">{title}</p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3">
        {lines.map((l) => (
          <div key={l.field} className="contents">
            <dt>{l.field}</dt>
            <dd className="break-words">{l.value}</dd>
          </div>
        ))}
      </dl>
    </div>
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
    initialState: { sorting: [{ id: "created_at", desc: true }], pagination: { pageIndex: 0, pageSize: 50 } },
  });
  const filter = (id: string) => table.getColumn(id)!;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200 sm:grid-cols-2 lg:grid-cols-4" role="search" aria-label="Filter the audit log">
        <TextFilter label="Who" value={(filter("who").getFilterValue() as string) ?? ""} onChange={(v) => filter("who").setFilterValue(v || undefined)} />
        <TextFilter label="What happened" hint="e.g. hid, suspended, checked in" value={(filter("what").getFilterValue() as string) ?? ""} onChange={(v) => filter("what").setFilterValue(v || undefined)} />
        <div className="flex flex-col gap-1">
          <label htmlFor="audit-on" className="text-sm font-medium">
            On
          </label>
          <select id="audit-on" className={inputClass} value={(filter("subject_type").getFilterValue() as string) ?? ""} onChange={(e) => filter("subject_type").setFilterValue(e.target.value || undefined)}>
            <option value="">anything</option>
            {subjectTypes.map((t) => (
              <option key={t} value={t}>
                {subjectWords({ subject_type: t, subject_name: null })}
              </option>
            ))}
          </select>
        </div>
        <TextFilter label="When" hint="e.g. 3 Dec" value={(filter("created_at").getFilterValue() as string) ?? ""} onChange={(v) => filter("created_at").setFilterValue(v || undefined)} />
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
      <input id={id} type="search" value={value} placeholder={hint} onChange={(e) => onChange(e.target.value)} className={inputClass} />
    </div>
  );
}
