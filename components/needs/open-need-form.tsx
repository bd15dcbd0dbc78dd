"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useForm, useWatch, type FieldPath, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { apiFetch, isApiError } from "@/lib/api/client";
import { MATERIAL_CODES, MATERIALS } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { materialNoun } from "@/lib/match/format";
import { BAG_WORDS, needInputUnits } from "@/lib/needs/units";
import type { NeedView } from "@/lib/needs/view";
import { openNeedFieldsSchema } from "@/lib/validation/needs";
import { Button } from "@/components/ui/button";
import { Field, SelectField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { Notice } from "@/components/ui/notice";
import { LocationPicker, type PickerWords } from "@/components/listings/location-picker";
import { maxRadiusShown, radiusSymbol, toNeedBody, type NeedFormValues } from "./need-form-values";
import { formatQuantity } from "@/lib/format/quantity";
import { MIN_CELL_AREA_KM2 } from "@/lib/needs/grid";

export interface BedChoice {
  id: string;
  name: string;
  /** The bed has a place saved, so a need for it needs no map click. */
  placed: boolean;
}

const placeWords = (system: UnitSystem): PickerWords => ({
  label: "Where you would collect to",
  hint: `Find your street or postcode, or click your home or the bed on the map. Only you see this point: suppliers and councils only ever see counts for an area of ${formatQuantity(MIN_CELL_AREA_KM2, "km2", system)} or more.`,
  map: "Map: click to set where the need is",
  placed: "Your need's place on the map",
});

/**
 * Open a need: a material, how much in the gardener's units, how far they would go, by
 * when, and how to be told. `fixed` is a bed's unmet need after matching: its material and
 * bed are set, only the rest can change.
 */
export function OpenNeedForm({
  system,
  initial,
  beds = [],
  fixed = false,
  onOpened,
}: {
  system: UnitSystem;
  initial: NeedFormValues;
  beds?: BedChoice[];
  fixed?: boolean;
  onOpened?: (need: NeedView) => void;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const schemaResolver = zodResolver(openNeedFieldsSchema);
  const resolver: Resolver<NeedFormValues> = (values, context, options) => schemaResolver(toNeedBody(values, system) as never, context, options as never) as never;
  const form = useForm<NeedFormValues>({ resolver, defaultValues: initial });
  const { register, setValue, formState } = form;
  const errors = formState.errors;
  const [material, bedId, location, unit] = useWatch({ control: form.control, name: ["material", "bed_id", "location", "unit"] });
  const units = needInputUnits(material, system);
  const prefix = fixed ? `need-${initial.material}` : "need";

  // The resolver hands over the parsed API body (SI), not what was typed.
  const onSubmit = form.handleSubmit(async (parsed) => {
    setError(null);
    try {
      const { need } = await apiFetch<{ need: NeedView }>("/api/needs", { body: parsed });
      onOpened?.(need);
      if (!fixed) form.reset({ ...form.getValues(), quantity: "" });
      router.refresh();
    } catch (err) {
      if (isApiError(err) && err.fields) for (const [k, message] of Object.entries(err.fields)) form.setError(k.split(".")[0] as FieldPath<NeedFormValues>, { message });
      setError(isApiError(err) ? err.message : "The need was not saved. Please try again.");
    }
  });

  const locationError = errors.location?.message ?? errors.location?.lat?.message ?? errors.location?.lng?.message ?? errors.bed_id?.message;
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label={fixed ? `Ask for ${materialNoun(initial.material)}` : "Ask for material"}>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {fixed ? null : (
        <SelectField
          label="Material"
          id={`${prefix}-material`}
          {...register("material", {
            onChange: (e) => {
              const next = needInputUnits(e.target.value, system);
              if (!next.some((u) => u.code === form.getValues("unit"))) setValue("unit", next[0].code);
            },
          })}
          error={errors.material?.message}
        >
          {MATERIAL_CODES.map((m) => (
            <option key={m} value={m}>
              {MATERIALS[m].name}
            </option>
          ))}
        </SelectField>
      )}
      <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)] gap-2">
        <Field label="How much" id={`${prefix}-quantity`} inputMode="decimal" {...register("quantity")} error={errors.quantity?.message} />
        <SelectField label="Counted in" id={`${prefix}-unit`} {...register("unit")} error={errors.unit?.message}>
          {units.map((u) => (
            <option key={u.code} value={u.code}>
              {u.label}
            </option>
          ))}
        </SelectField>
      </div>
      {unit === "bags" ? <p className="-mt-3 text-sm text-humus-600">{BAG_WORDS}</p> : null}
      <div className="grid gap-2 sm:grid-cols-2">
        <Field
          label={`How far you would go (${radiusSymbol(system)})`}
          id={`${prefix}-radius`}
          inputMode="decimal"
          {...register("radius_km")}
          error={errors.radius_km?.message}
          hint={`Up to ${maxRadiusShown(system)} ${radiusSymbol(system)}.`}
        />
        <Field label="Needed by" id={`${prefix}-date`} type="date" {...register("needed_by")} error={errors.needed_by?.message} hint={fixed ? "Left empty: the bed's build day." : "Left empty: eight weeks from now."} />
      </div>
      {fixed ? null : (
        <>
          {beds.length ? (
            <SelectField label="For" id={`${prefix}-bed`} {...register("bed_id")} error={errors.bed_id?.message}>
              <option value="">A place I pick on the map</option>
              {beds.map((b) => (
                <option key={b.id} value={b.id} disabled={!b.placed}>
                  {b.name}
                  {b.placed ? "" : " (no place saved)"}
                </option>
              ))}
            </SelectField>
          ) : null}
          {bedId ? null : <LocationPicker value={location} onChange={(p) => setValue("location", p, { shouldValidate: formState.isSubmitted })} error={locationError} words={placeWords(system)} className="h-60" />}
        </>
      )}
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-medium">Tell me by e-mail</legend>
        <label className="flex items-start gap-2">
          <input type="radio" value="daily" {...register("alerts")} className="mt-1 h-5 w-5 shrink-0" />
          <span>Once a day at most, everything found that day</span>
        </label>
        <label className="flex items-start gap-2">
          <input type="radio" value="immediate" {...register("alerts")} className="mt-1 h-5 w-5 shrink-0" />
          <span>At once, for each listing</span>
        </label>
      </fieldset>
      <Button type="submit" disabled={formState.isSubmitting} className="self-start">
        {formState.isSubmitting ? "Saving…" : fixed ? "Tell me when it is listed" : "Open this need"}
      </Button>
    </Form>
  );
}
