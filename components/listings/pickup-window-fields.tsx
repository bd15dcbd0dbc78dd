"use client";
import { useFieldArray, useWatch, type UseFormReturn } from "react-hook-form";
import { GroupError } from "@/components/ui/field";
import { WEEKDAYS } from "@/lib/listings/format";
import type { ListingFormState } from "./form-values";

const input = "min-h-11 rounded-lg border border-humus-300 bg-white px-3";

/** Weekly times ("Saturdays 9–12") and one-off dates, in the pickup place's local time. */
export function PickupWindowFields({ form }: { form: UseFormReturn<ListingFormState> }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: "pickup_windows" });
  const errors = form.formState.errors.pickup_windows;
  const kinds = useWatch({ control: form.control, name: "pickup_windows" }).map((w) => w?.kind);
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="font-medium">When people can collect</legend>
      <p className="text-sm text-humus-600">Local time at the pickup point.</p>
      {fields.map((f, i) => {
        const kind = kinds[i] ?? f.kind;
        const e = errors?.[i];
        const message = e?.end_time?.message ?? e?.ends_at?.message ?? e?.start_time?.message ?? e?.starts_at?.message ?? e?.weekday?.message ?? e?.message;
        return (
          <div key={f.id} className="flex flex-wrap items-end gap-2 rounded-lg bg-humus-50 p-3 ring-1 ring-humus-200">
            <label className="flex flex-col text-sm">
              Kind
              <select {...form.register(`pickup_windows.${i}.kind`)} className={input}>
                <option value="weekly">Every week</option>
                <option value="dated">On a date</option>
              </select>
            </label>
            {kind === "weekly" ? (
              <>
                <label className="flex flex-col text-sm">
                  Day
                  <select {...form.register(`pickup_windows.${i}.weekday`)} className={input}>
                    {WEEKDAYS.map((d, n) => (
                      <option key={d} value={String(n)}>
                        {d}
                      </option>
                    ))}
                  </select>
                </label>
                <label className="flex flex-col text-sm">
                  From
                  <input type="time" {...form.register(`pickup_windows.${i}.start_time`)} className={input} />
                </label>
                <label className="flex flex-col text-sm">
                  Until
                  <input type="time" {...form.register(`pickup_windows.${i}.end_time`)} className={input} />
                </label>
              </>
            ) : (
              <>
                <label className="flex flex-col text-sm">
                  Starts
                  <input type="datetime-local" {...form.register(`pickup_windows.${i}.starts_at`)} className={input} />
                </label>
                <label className="flex flex-col text-sm">
                  Ends
                  <input type="datetime-local" {...form.register(`pickup_windows.${i}.ends_at`)} className={input} />
                </label>
              </>
            )}
            <button type="button" onClick={() => remove(i)} className="min-h-11 rounded-lg px-3 text-sm text-ember-800 ring-1 ring-ember-600/40" aria-label={`Remove pickup time ${i + 1}`}>
              Remove
            </button>
            <div className="basis-full">
              <GroupError id={`pickup-window-${i}-error`} error={message} />
            </div>
          </div>
        );
      })}
      <div className="flex flex-wrap gap-2">
        <button type="button" className="min-h-11 rounded-lg px-3 text-sm font-medium ring-1 ring-humus-300" onClick={() => append({ kind: "weekly", weekday: "6", start_time: "09:00", end_time: "12:00", starts_at: "", ends_at: "" })}>
          Add a weekly time
        </button>
        <button type="button" className="min-h-11 rounded-lg px-3 text-sm font-medium ring-1 ring-humus-300" onClick={() => append({ kind: "dated", weekday: "6", start_time: "09:00", end_time: "12:00", starts_at: "", ends_at: "" })}>
          Add a date
        </button>
      </div>
      <GroupError id="pickup-windows-error" error={errors?.message ?? errors?.root?.message} />
    </fieldset>
  );
}
