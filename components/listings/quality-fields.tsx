"use client";
import { useWatch, type UseFormReturn } from "react-hook-form";
import { GroupError, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { listingCautions } from "@/lib/calc/cautions";
import type { MaterialCode } from "@/lib/calc/facts";
import { HERBICIDE_MATERIALS } from "@/lib/validation/listings";
import type { ListingFormState } from "./form-values";

const WORM_SPECIES = ["Eisenia fetida", "Eisenia andrei", "Dendrobaena veneta", "Perionyx excavatus", "Eudrilus eugeniae"];

function Radios({ form, name, options, legend, error }: { form: UseFormReturn<ListingFormState>; name: "quality.herbicide_history" | "quality.leaf_source"; options: [string, string][]; legend: string; error?: string }) {
  const errorId = `${name.replace(".", "-")}-error`;
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? errorId : undefined}>
      <legend className="font-medium">{legend}</legend>
      {options.map(([value, label]) => (
        <label key={value} className="flex items-start gap-2">
          <input type="radio" value={value} {...form.register(name)} className="mt-1 h-5 w-5" /> {label}
        </label>
      ))}
      <GroupError id={errorId} error={error} />
    </fieldset>
  );
}

/** What the supplier declares about this material, and the cautions gardeners will read because of it. */
export function QualityFields({ form, material }: { form: UseFormReturn<ListingFormState>; material: MaterialCode }) {
  const errors = form.formState.errors.quality;
  const [q, unit, massText] = useWatch({ control: form.control, name: ["quality", "unit", "unit_mass_kg"] });
  const mass = Number(massText) || null;
  const cautions = listingCautions({ material, unit, unit_mass_kg: mass, quality: { ...q, tape_removed: q.tape_removed, herbicide_history: q.herbicide_history || undefined } });
  return (
    <div className="flex flex-col gap-3">
      {material === "cardboard" ? (
        <fieldset className="flex flex-col gap-2">
          <legend className="font-medium">The board</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" {...form.register("quality.tape_removed")} className="h-5 w-5" /> Tape, staples and plastic are removed
          </label>
          <label className="flex items-center gap-2">
            <input type="checkbox" {...form.register("quality.no_glossy_print")} className="h-5 w-5" /> No glossy, waxed or coated print
          </label>
        </fieldset>
      ) : null}
      {material === "leaves" ? (
        <Radios
          form={form}
          name="quality.leaf_source"
          legend="Where the leaves came from"
          error={errors?.leaf_source?.message}
          options={[
            ["garden", "Raked from gardens or a lawn"],
            ["park", "From a park or green, kept apart from street sweepings"],
            ["roadside", "Swept or vacuumed from a street or roadside"],
          ]}
        />
      ) : null}
      {HERBICIDE_MATERIALS.includes(material) ? (
        <Radios
          form={form}
          name="quality.herbicide_history"
          legend="Weedkiller on the field, hay or feed"
          error={errors?.herbicide_history?.message}
          options={[
            ["known_untreated", "I know no persistent weedkiller (aminopyralid, clopyralid or similar) was used"],
            ["unknown", "I don't know"],
          ]}
        />
      ) : null}
      {material === "worms" ? (
        <div className="flex flex-col gap-1">
          <label htmlFor="field-species" className="font-medium">
            Species
          </label>
          <p id="field-species-hint" className="text-sm text-humus-600">
            Buyers need the scientific name: some earthworms are invasive in some regions.
          </p>
          <input
            id="field-species"
            list="worm-species"
            {...form.register("quality.species")}
            aria-invalid={errors?.species ? true : undefined}
            aria-describedby={`field-species-hint${errors?.species ? " field-species-error" : ""}`}
            className={inputClass}
          />
          <datalist id="worm-species">
            {WORM_SPECIES.map((s) => (
              <option key={s} value={s} />
            ))}
          </datalist>
          <GroupError id="field-species-error" error={errors?.species?.message} />
          <fieldset className="mt-2 flex flex-col gap-1" aria-describedby="field-quality.ships-error">
            <legend className="font-medium">How buyers get it</legend>
            <div className="flex flex-wrap gap-4">
              <label className="flex min-h-11 items-center gap-2">
                <input id="field-quality.ships" type="checkbox" className="h-5 w-5" {...form.register("quality.ships")} /> Posted to them
              </label>
              <label className="flex min-h-11 items-center gap-2">
                <input type="checkbox" className="h-5 w-5" {...form.register("quality.pickup")} /> Collected from you
              </label>
            </div>
            <GroupError id="field-quality.ships-error" error={errors?.ships?.message} />
          </fieldset>
        </div>
      ) : null}
      {errors?.message ? <GroupError id="quality-error" error={errors.message} /> : null}
      <Notice tone="caution" title="Gardeners will read this beside your listing">
        <ul className="list-disc pl-5">
          {cautions.map((c) => (
            <li key={c.kind}>{c.text}</li>
          ))}
        </ul>
      </Notice>
    </div>
  );
}
