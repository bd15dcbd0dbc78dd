"use client";
import { useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { useRouter } from "next/navigation";
import { apiFetch, isApiError } from "@/lib/api/client";
import { GIVEAWAY_MATERIAL_LABELS, GIVEAWAY_MATERIALS } from "@/lib/validation/giveaways";
import { LocationPicker } from "@/components/listings/location-picker";
import { useUnits } from "@/components/ui/units-context";
import { fewHundred } from "@/lib/format/quantity";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { dayResolver, makeSlots, toDayBody, type DayFormValues } from "./day-form-model";
import { Form } from "@/components/ui/form";

export interface DayFormProps {
  mode: "create" | "edit";
  initial: DayFormValues;
  dayId?: string;
  /** Households have booked: the date, unit and material stay as they are. */
  locked?: boolean;
}

const selectClass = "min-h-11 rounded-lg border border-humus-300 bg-white px-3 py-2";

export function DayForm({ mode, initial, dayId, locked = false }: DayFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const resolver = useMemo(() => dayResolver(mode), [mode]);
  const form = useForm<DayFormValues>({ resolver, defaultValues: initial });
  const { system } = useUnits();
  const { register, control, setValue, formState } = form;
  const slots = useFieldArray({ control, name: "slots" });
  const [unit, location] = useWatch({ control, name: ["unit", "location"] });
  const [gen, setGen] = useState({ from: "09:00", to: "12:00", minutes: "30", capacity: "10" });
  const errors = formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    setSaved(false);
    try {
      if (mode === "create") {
        const res = await apiFetch<{ giveaway: { id: string } }>("/api/council/giveaways", { body: toDayBody(values) });
        router.push(`/council/giveaways/${res.giveaway.id}`);
        router.refresh();
        return;
      }
      const changed = new Set(Object.keys(formState.dirtyFields) as (keyof DayFormValues)[]);
      if (!changed.size) {
        setSaved(true);
        return;
      }
      await apiFetch(`/api/council/giveaways/${dayId}`, { method: "PATCH", body: toDayBody(values, changed) });
      form.reset(values);
      setSaved(true);
      router.refresh();
    } catch (err) {
      if (isApiError(err) && err.fields) {
        for (const [k, m] of Object.entries(err.fields)) form.setError((k === "deposit_cents" ? "deposit_eur" : k === "booking_closes_at" ? "closes_local" : k) as keyof DayFormValues, { message: m });
      }
      setError(isApiError(err) ? err.message : "The day could not be saved. Please try again.");
    }
  });

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label={mode === "create" ? "New giveaway day" : "Change the day"}>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {saved ? <Notice>Saved.</Notice> : null}
      {locked ? <Notice>Households have booked, so the date, material and unit stay as they are. Call the day off and make a new one to change them.</Notice> : null}
      <div className="grid gap-4 md:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor="field-material" className="font-medium">
            Material
          </label>
          <select id="field-material" className={selectClass} disabled={locked} {...register("material")}>
            {GIVEAWAY_MATERIALS.map((m) => (
              <option key={m} value={m}>
                {GIVEAWAY_MATERIAL_LABELS[m]}
              </option>
            ))}
          </select>
        </div>
        <Field label="Title" hint="What residents see, e.g. “Autumn leaves at the depot”." {...register("title")} error={errors.title?.message} />
        <Field label="Date" type="date" disabled={locked} {...register("date")} error={errors.date?.message} />
        <Field label="Address households come to" hint="Shown only to households that book." {...register("address")} error={errors.address?.message} />
      </div>

      <LocationPicker
        value={location ?? { lat: null, lng: null }}
        onChange={(p) => setValue("location", p, { shouldDirty: true, shouldValidate: formState.isSubmitted })}
        error={errors.location?.message}
        words={{
          label: "Where households collect",
          hint: `Find the street or postcode, then click the map on the gate or the pile. The public sees a point ${fewHundred(system)} away until they book.`,
          map: "Map: click where households collect",
          placed: "The place on the map",
        }}
        className="h-64"
      />

      <fieldset className="grid gap-4 rounded-lg bg-white p-4 ring-1 ring-humus-200 md:grid-cols-3">
        <legend className="px-1 font-semibold">How much a household may take</legend>
        <div className="flex flex-col gap-1">
          <label htmlFor="field-unit" className="font-medium">
            Counted in
          </label>
          <select id="field-unit" className={selectClass} disabled={locked} {...register("unit")}>
            <option value="bags">bags</option>
            <option value="m3">cubic metres (m³)</option>
          </select>
        </div>
        {unit === "bags" ? (
          <Field label="One bag holds (litres)" inputMode="decimal" disabled={locked} hint="A paper lawn-and-leaf bag is about 114 L." {...register("bag_litres")} error={errors.bag_litres?.message} />
        ) : (
          <div />
        )}
        <Field label={`Cap per household (${unit === "bags" ? "bags" : "m³"})`} inputMode="decimal" {...register("household_cap")} error={errors.household_cap?.message} />
      </fieldset>

      <fieldset className="grid gap-4 rounded-lg bg-white p-4 ring-1 ring-humus-200 md:grid-cols-3">
        <legend className="px-1 font-semibold">Booking</legend>
        <Field label="Booking closes" type="datetime-local" hint="Fernhollow time. Empty: 18:00 the evening before, or when the last slot starts for a day that is sooner." {...register("closes_local")} error={errors.closes_local?.message} />
        <Field label="Cancel up to (hours before the slot)" inputMode="numeric" {...register("cancel_cutoff_hours")} error={errors.cancel_cutoff_hours?.message} />
        <Field
          label="No-show deposit (€)"
          inputMode="decimal"
          hint="0 for none. Otherwise each household puts it on hold on a card to book (at least €0.50); it is released when they are checked in, cancel in time or you call the day off, and taken only for a no-show you mark after their slot."
          {...register("deposit_eur")}
          error={errors.deposit_eur?.message}
        />
      </fieldset>

      <div className="flex flex-col gap-1">
        <label htmlFor="field-notes" className="font-medium">
          Notes for households
        </label>
        <textarea id="field-notes" rows={3} className={inputClass} {...register("notes")} />
      </div>

      {mode === "create" ? (
        <fieldset className="flex flex-col gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200">
          <legend className="px-1 font-semibold">Time slots</legend>
          <div className="grid grid-cols-2 gap-3 md:grid-cols-5">
            <GenField label="From" type="time" value={gen.from} onChange={(v) => setGen({ ...gen, from: v })} />
            <GenField label="Until" type="time" value={gen.to} onChange={(v) => setGen({ ...gen, to: v })} />
            <GenField label="Minutes a slot" value={gen.minutes} onChange={(v) => setGen({ ...gen, minutes: v })} />
            <GenField label="Households a slot" value={gen.capacity} onChange={(v) => setGen({ ...gen, capacity: v })} />
            <Button variant="secondary" className="self-end" onClick={() => slots.replace(makeSlots(gen.from, gen.to, Number(gen.minutes), gen.capacity))}>
              Make slots
            </Button>
          </div>
          {slots.fields.length ? (
            <ol className="flex flex-col gap-2">
              {slots.fields.map((f, i) => (
                <li key={f.id} className="grid grid-cols-[1fr_1fr_1fr_auto] items-start gap-2">
                  <Field label={`Slot ${i + 1} starts`} type="time" {...register(`slots.${i}.start`)} error={errors.slots?.[i]?.start?.message} />
                  <Field label="ends" type="time" {...register(`slots.${i}.end`)} error={errors.slots?.[i]?.end?.message} />
                  <Field label="households" inputMode="numeric" {...register(`slots.${i}.capacity`)} error={errors.slots?.[i]?.capacity?.message} />
                  <Button variant="quiet" className="mt-8" onClick={() => slots.remove(i)}>
                    Remove<span className="sr-only"> slot {i + 1}</span>
                  </Button>
                </li>
              ))}
            </ol>
          ) : (
            <p className="text-sm text-humus-600">No slots yet: make them above, or add slots after saving.</p>
          )}
          <Button variant="quiet" className="self-start" onClick={() => slots.append({ start: "13:00", end: "13:30", capacity: gen.capacity })}>
            Add one slot
          </Button>
        </fieldset>
      ) : null}

      <Button type="submit" className="self-start" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Saving…" : mode === "create" ? "Create the day" : "Save changes"}
      </Button>
    </Form>
  );
}

function GenField({ label, value, onChange, type = "text" }: { label: string; value: string; onChange: (v: string) => void; type?: string }) {
  const id = `gen-${label.toLowerCase().replace(/\W+/g, "-")}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <input id={id} type={type} inputMode={type === "text" ? "numeric" : undefined} value={value} onChange={(e) => onChange(e.target.value)} className={inputClass} />
    </div>
  );
}
