"use client";
import { useState } from "react";
import type { SlotView } from "@/lib/giveaways/view";
import { wallTime } from "@/lib/time/zoned";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";
import { inputClass } from "@/components/ui/field";

/** Each slot's fill, with its size changed or the slot removed; new slots added below. */
export function SlotEditor({ dayId, slots, timeZone, editable }: { dayId: string; slots: SlotView[]; timeZone: string; editable: boolean }) {
  const action = useApiAction();
  const [sizes, setSizes] = useState<Record<string, string>>({});
  const [add, setAdd] = useState({ start: "", end: "", capacity: "10" });
  return (
    <div className="flex flex-col gap-3">
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      {slots.length === 0 ? <p className="text-humus-700">No slots yet: households cannot book until there is one.</p> : null}
      {editable && slots.length > 0 ? (
        <p className="text-sm text-humus-700">Change how many households a slot takes and save it; it cannot go below the households already booked. A slot nobody has booked can be removed.</p>
      ) : null}
      <ul className="divide-y divide-humus-100">
        {slots.map((s) => {
          const label = `${wallTime(s.starts_at, timeZone)}–${wallTime(s.ends_at, timeZone)}`;
          return (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
              <span className="flex items-center gap-3">
                <span className="font-medium">{label}</span>
                <meter min={0} max={s.capacity} value={s.booked} className="w-24" aria-label={`${label}: ${s.booked} of ${s.capacity} booked`} />
                <span className="text-sm text-humus-700">
                  {s.booked} of {s.capacity} booked
                </span>
              </span>
              {editable ? (
                <span className="flex items-center gap-2">
                  <label className="text-sm" htmlFor={`size-${s.id}`}>
                    Households<span className="sr-only"> in the {label} slot</span>
                  </label>
                  <input
                    id={`size-${s.id}`}
                    inputMode="numeric"
                    className={`${inputClass} w-20`}
                    value={sizes[s.id] ?? String(s.capacity)}
                    onChange={(e) => setSizes({ ...sizes, [s.id]: e.target.value })}
                  />
                  <Button variant="secondary" disabled={action.busy} onClick={() => action.run(`/api/council/giveaways/${dayId}/slots/${s.id}`, { method: "PATCH", body: { capacity: Number(sizes[s.id] ?? s.capacity) } })}>
                    Save places<span className="sr-only"> for {label}</span>
                  </Button>
                  {s.booked === 0 ? (
                    <Button variant="quiet" disabled={action.busy} onClick={() => action.run(`/api/council/giveaways/${dayId}/slots/${s.id}`, { method: "DELETE" })}>
                      Remove<span className="sr-only"> {label}</span>
                    </Button>
                  ) : null}
                </span>
              ) : null}
            </li>
          );
        })}
      </ul>
      {editable ? (
        <Form
          className="flex flex-wrap items-end gap-2"
          aria-label="Add a slot"
          onSubmit={(e) => {
            e.preventDefault();
            void action.run(`/api/council/giveaways/${dayId}/slots`, { body: { slots: [{ start: add.start, end: add.end, capacity: Number(add.capacity) }] } }, () => setAdd({ ...add, start: "", end: "" }));
          }}
        >
          {(["start", "end", "capacity"] as const).map((k) => (
            <label key={k} className="flex flex-col gap-1 text-sm font-medium">
              {k === "start" ? "New slot starts" : k === "end" ? "ends" : "households"}
              <input
                type={k === "capacity" ? "text" : "time"}
                inputMode={k === "capacity" ? "numeric" : undefined}
                value={add[k]}
                onChange={(e) => setAdd({ ...add, [k]: e.target.value })}
                className={`${inputClass} font-normal`}
              />
            </label>
          ))}
          <Button type="submit" variant="secondary" disabled={action.busy}>
            Add slot
          </Button>
        </Form>
      ) : null}
    </div>
  );
}
