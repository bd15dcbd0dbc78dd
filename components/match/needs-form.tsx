"use client";
import { Controller, useFieldArray, type UseFormReturn } from "react-hook-form";
import { MATERIAL_CODES, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { inputUnit, type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun, radiusHint, radiusProblem } from "@/lib/match/format";
import { MAX_NEEDS, MAX_RADIUS_KM } from "@/lib/match/defaults";
import type { MatchInput, MatchRequest } from "@/lib/validation/match";
import { NEED_UNITS } from "@/lib/match/units";
import { Button } from "@/components/ui/button";
import { MeasureField } from "@/components/ui/measure-field";
import { Form } from "@/components/ui/form";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";

/** The form holds what POST /api/match takes, checked by the same schema. */
export type NeedsFormValues = MatchRequest;
export type NeedsFormApi = UseFormReturn<MatchRequest, unknown, MatchInput>;

const selectClass = "min-h-11 rounded-lg border border-humus-300 bg-white px-2 py-2";

/** The needs, the start point and the radius, as one form; the map beside it moves the start. */
export function NeedsForm({
  form,
  system,
  onSubmit,
  busy,
  place,
  onPlace,
}: {
  form: NeedsFormApi;
  system: UnitSystem;
  onSubmit: () => void;
  busy: boolean;
  /** The start, in words (the map marks it too). */
  place: ChosenPlace | null;
  onPlace: (p: ChosenPlace) => void;
}) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: "needs" });
  const errors = form.formState.errors;
  const needs = form.watch("needs") ?? [];

  const setStart = (p: ChosenPlace) => {
    onPlace(p);
    form.setValue("origin", { lat: p.lat, lng: p.lng }, { shouldValidate: form.formState.isSubmitted });
  };

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="What the bed needs">
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-lg font-semibold">What the bed needs</legend>
        {errors.needs?.message || errors.needs?.root?.message ? (
          <p role="alert" className="text-sm text-ember-600">
            {errors.needs?.message ?? errors.needs?.root?.message}
          </p>
        ) : null}
        {fields.map((f, i) => {
          const material = needs[i]?.material ?? f.material;
          const unit = needs[i]?.unit ?? f.unit;
          const err = errors.needs?.[i];
          const unitId = `need-${i}-unit`;
          return (
            <div key={f.id} className="grid grid-cols-[minmax(0,1fr)_6rem] items-start gap-x-2 rounded-lg bg-humus-50 p-3 ring-1 ring-humus-200" data-need-row={i}>
              <div className="col-span-2 mb-2 flex flex-col gap-1">
                <label htmlFor={`need-${i}-material`} className="font-medium">
                  Material
                </label>
                <select
                  id={`need-${i}-material`}
                  className={selectClass}
                  {...form.register(`needs.${i}.material`, {
                    onChange: (e) => {
                      const allowed = NEED_UNITS[e.target.value as MaterialCode];
                      const now = form.getValues(`needs.${i}.unit`);
                      if (!now || !allowed.includes(now)) form.setValue(`needs.${i}.unit`, allowed[0]);
                    },
                  })}
                >
                  {MATERIAL_CODES.map((m) => (
                    <option key={m} value={m}>
                      {MATERIALS[m].name}
                    </option>
                  ))}
                </select>
              </div>
              <Controller
                control={form.control}
                name={`needs.${i}.quantity`}
                render={({ field }) => (
                  <MeasureField
                    label="Amount"
                    name={field.name}
                    id={`need-${i}-quantity`}
                    unit={unit}
                    system={system}
                    value={Number(field.value)}
                    onChange={field.onChange}
                    error={err?.quantity?.message}
                  />
                )}
              />
              <div className="flex flex-col gap-1">
                <label htmlFor={unitId} className="font-medium">
                  Unit
                </label>
                <select id={unitId} className={selectClass} aria-describedby={err?.unit ? `${unitId}-error` : undefined} {...form.register(`needs.${i}.unit`)}>
                  {NEED_UNITS[material].map((u) => (
                    <option key={u} value={u}>
                      {inputUnit(u, system).symbol}
                    </option>
                  ))}
                </select>
                <p id={`${unitId}-error`} aria-live="polite" className="text-sm text-ember-600">
                  {err?.unit?.message ?? err?.material?.message ?? ""}
                </p>
              </div>
              <Button variant="quiet" className="col-span-2 justify-self-end text-sm" onClick={() => remove(i)} aria-label={`Remove ${materialNoun(material)}`}>
                Remove
              </Button>
            </div>
          );
        })}
        {fields.length < MAX_NEEDS ? (
          <Button variant="secondary" className="self-start" onClick={() => append({ material: "leaves", quantity: 0.5, unit: "m3" })}>
            Add a material
          </Button>
        ) : null}
      </fieldset>

      <PlaceSearch
        label="Where you start"
        name="origin"
        hint="A street, village or postcode, or where you are now; you can also tap the map."
        value={place}
        onChange={setStart}
        error={errors.origin?.message ?? errors.origin?.lat?.message ?? errors.origin?.lng?.message}
      />

      <Controller
        control={form.control}
        name="radius_km"
        render={({ field }) => (
          <MeasureField
            label="Look within"
            name={field.name}
            unit="km"
            system={system}
            value={Number(field.value)}
            onChange={field.onChange}
            max={MAX_RADIUS_KM}
            // The schema speaks in km (the API's unit); the reader is told in theirs.
            error={errors.radius_km ? radiusProblem(system) : undefined}
            hint={radiusHint(system)}
          />
        )}
      />
      <Button type="submit" disabled={busy}>
        {busy ? "Finding…" : "Find materials"}
      </Button>
    </Form>
  );
}
