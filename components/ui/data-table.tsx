"use client";
import type { ReactNode } from "react";
import type { ReactTable, RowData, TableFeatures } from "@tanstack/react-table";

// The one way a TanStack table is drawn: a caption for screen readers, headings that sort
// when their column can, and a designed line when no row is left. With `stack`, a phone shows
// one card per row instead (globals.css .stack-table), each cell named by its column.
interface SortableColumn {
  id: string;
  getCanSort?: () => boolean;
  getIsSorted?: () => false | "asc" | "desc";
  getToggleSortingHandler?: () => ((event: unknown) => void) | undefined;
}

const SORT_MARK = { asc: " ↑", desc: " ↓" } as const;

export const tableShell = "overflow-x-auto rounded-lg bg-white ring-1 ring-humus-200";
export const tableClass = "w-full text-left text-sm";
export const headClass = "bg-humus-100";
export const rowClass = "border-t border-humus-100 align-top";

export function DataTable<TFeatures extends TableFeatures, TData extends RowData, TSelected>({ table, caption, empty, rowProps, unsortable = [], dense = false, stack }: { table: ReactTable<TFeatures, TData, TSelected>; caption: string; empty: ReactNode; rowProps?: (row: TData) => Record<string, string>; unsortable?: string[]; dense?: boolean; stack?: { unlabelled?: string[] } }) {
  const rows = table.getRowModel().rows;
  const pad = dense ? "p-2" : "p-3";
  return (
    <div className={tableShell}>
      <table className={stack ? `stack-table ${tableClass}` : tableClass}>
        <caption className="sr-only">{caption}</caption>
        <thead className={headClass}>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const column = header.column as unknown as SortableColumn;
                const sorted = column.getIsSorted?.() ?? false;
                const canSort = (column.getCanSort?.() ?? false) && !unsortable.includes(column.id);
                return (
                  <th key={header.id} scope="col" className={pad} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                    {canSort ? (
                      <button type="button" onClick={column.getToggleSortingHandler?.()} className="font-semibold underline-offset-4 hover:underline">
                        <table.FlexRender header={header} />
                        {sorted ? SORT_MARK[sorted] : ""}
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.id} className={rowClass} {...(rowProps ? rowProps(row.original) : {})}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={pad} data-label={stack && !stack.unlabelled?.includes(cell.column.id) ? String(cell.column.columnDef.header ?? "") : undefined}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length === 0 ? <p className="p-4 text-humus-700">{empty}</p> : null}
    </div>
  );
}
