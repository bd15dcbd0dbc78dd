"use client";
import { useMemo, useState } from "react";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { wallTime } from "@/lib/time/zoned";
import { depositLabel } from "@/lib/format/giveaway-deposit";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { inputClass } from "@/components/ui/field";

export interface CheckInRow {
  id: string;
  name: string;
  quantity: number;
  status: string;
  starts_at: string;
  ends_at: string;
  deposit_cents: number;
  deposit_status: string;
}

/**
 * The phone at the gate: find a household, tap once to check them in (or undo). Checking in
 * releases a deposit hold; once a slot has ended, a household that did not come can be marked
 * a no-show, which keeps (captures) its deposit — that mark cannot then be undone.
 */
export function CheckInList({ dayId, rows, unit, timeZone, currency, now }: { dayId: string; rows: CheckInRow[]; unit: "bags" | "m3"; timeZone: string; currency: string; now: string }) {
  const action = useApiAction();
  const [q, setQ] = useState("");
  const [pending, setPending] = useState<string | null>(null);
  const shown = useMemo(() => rows.filter((r) => r.name.toLowerCase().includes(q.trim().toLowerCase())), [rows, q]);
  const arrived = rows.filter((r) => r.status === "checked_in").length;
  const mark = async (row: CheckInRow, status: "checked_in" | "booked" | "no_show") => {
    setPending(row.id);
    await action.run(`/api/council/giveaways/${dayId}/bookings/${row.id}`, { method: "PATCH", body: { status }, idempotent: true });
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
      <input id="find" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Name" className={`${inputClass} min-h-12 text-lg`} />
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <ul className="flex flex-col gap-2">
        {shown.map((r) => {
          const done = r.status === "checked_in";
          const noShow = r.status === "no_show";
          const deposit = depositLabel(r.deposit_cents, currency, r.deposit_status);
          const slotOver = Date.parse(now) >= Date.parse(r.ends_at);
          return (
            <li key={r.id} data-booking={r.id} className={`flex items-center justify-between gap-3 rounded-lg p-3 ring-1 ${done ? "bg-moss-50 ring-moss-300" : "bg-white ring-humus-200"}`}>
              <span className="min-w-0">
                <span className="block truncate text-lg font-semibold">{r.name}</span>
                <span className="text-sm text-humus-700">
                  {wallTime(r.starts_at, timeZone)} · {formatGiveawayQuantity(r.quantity, unit)}
                  {done ? " · checked in" : noShow ? " · no-show" : ""}
                  {deposit ? ` · deposit ${deposit}` : ""}
                </span>
              </span>
              {noShow ? (
                r.deposit_status === "kept" ? null : (
                  <Button variant="secondary" disabled={pending === r.id} onClick={() => mark(r, "booked")}>
                    Undo<span className="sr-only"> no-show for {r.name}</span>
                  </Button>
                )
              ) : done ? (
                <Button variant="secondary" disabled={pending === r.id} onClick={() => mark(r, "booked")}>
                  Undo<span className="sr-only"> check-in for {r.name}</span>
                </Button>
              ) : (
                <span className="flex flex-col gap-1">
                  <Button className="min-w-28 text-lg" disabled={pending === r.id} onClick={() => mark(r, "checked_in")}>
                    {pending === r.id ? "…" : "Check in"}
                    <span className="sr-only"> {r.name}</span>
                  </Button>
                  {slotOver ? (
                    <Button
                      variant="quiet"
                      disabled={pending === r.id}
                      onClick={() => {
                        if (r.deposit_status !== "held" || window.confirm(`Mark ${r.name} a no-show? Their ${deposit.split(" ")[0]} deposit is kept, and this cannot be undone.`)) void mark(r, "no_show");
                      }}
                    >
                      No-show<span className="sr-only"> {r.name}</span>
                    </Button>
                  ) : null}
                </span>
              )}
            </li>
          );
        })}
      </ul>
      {shown.length === 0 ? <p className="text-humus-700">{rows.length ? "Nobody by that name is booked." : "Nobody has booked this day."}</p> : null}
    </div>
  );
}
