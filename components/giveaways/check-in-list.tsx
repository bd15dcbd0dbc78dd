"use client";
import { useMemo, useState } from "react";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { wallTime } from "@/lib/time/zoned";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";

export interface CheckInRow {
  id: string;
  name: string;
  quantity: number;
  status: string;
  starts_at: string;
}

/** The phone at the gate: find a household, tap once to check them in (or undo). */
export function CheckInList({ dayId, rows, unit, timeZone }: { dayId: string; rows: CheckInRow[]; unit: "bags" | "m3"; timeZone: string }) {
  const action = useApiAction();
  const [q, setQ] = useState("");
  const [pending, setPending] = useState<string | null>(null);
  const shown = useMemo(() => rows.filter((r) => r.name.toLowerCase().includes(q.trim().toLowerCase())), [rows, q]);
  const arrived = rows.filter((r) => r.status === "checked_in").length;
  const mark = async (row: CheckInRow, status: "checked_in" | "booked") => {
    setPending(row.id);
    await action.run(`/api/council/giveaways/${dayId}/bookings/${row.id}`, { method: "PATCH", body: { status } });
    setPending(null);
  };
  return (
    <div className="flex flex-col gap-3">
      <p className="text-lg" aria-live="polite">
        <strong>{arrived}</strong> of {rows.length} households checked in
      </p>
      <label htmlFor="find" className="font-medium">
        Find a household
      </label>
      <input id="find" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Name" className="min-h-12 rounded-lg border border-humus-300 bg-white px-3 text-lg" />
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <ul className="flex flex-col gap-2">
        {shown.map((r) => {
          const done = r.status === "checked_in";
          return (
            <li key={r.id} data-booking={r.id} className={`flex items-center justify-between gap-3 rounded-lg p-3 ring-1 ${done ? "bg-moss-50 ring-moss-300" : "bg-white ring-humus-200"}`}>
              <span className="min-w-0">
                <span className="block truncate text-lg font-semibold">{r.name}</span>
                <span className="text-sm text-humus-700">
                  {wallTime(r.starts_at, timeZone)} · {formatGiveawayQuantity(r.quantity, unit)}
                  {done ? " · checked in" : ""}
                </span>
              </span>
              {done ? (
                <Button variant="secondary" disabled={pending === r.id} onClick={() => mark(r, "booked")}>
                  Undo<span className="sr-only"> check-in for {r.name}</span>
                </Button>
              ) : (
                <Button className="min-w-28 text-lg" disabled={pending === r.id} onClick={() => mark(r, "checked_in")}>
                  {pending === r.id ? "…" : "Check in"}
                  <span className="sr-only"> {r.name}</span>
                </Button>
              )}
            </li>
          );
        })}
      </ul>
      {shown.length === 0 ? <p className="text-humus-700">{rows.length ? "Nobody by that name is booked." : "Nobody has booked this day."}</p> : null}
    </div>
  );
}
