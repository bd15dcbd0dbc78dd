"use client";
import { useEffect } from "react";
import { useRouter } from "next/navigation";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Button } from "@/components/ui/button";
import { Field, GroupError, SelectField, TextAreaField } from "@/components/ui/field";
import { ErrorSummary, useErrorSummary } from "@/components/ui/error-summary";
import { apiFetch } from "@/lib/api/client";
import { MATERIAL_CODES, MATERIALS } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { createListingSchema, defaultUnitSize, UNITS_BY_MATERIAL, type CreateListingInput } from "@/lib/validation/listings";
import { emptyForm, quantitySymbol, toBody, unitSizeField, unitSizePlaceholder, type ListingFormState } from "./form-values";
import { DemandPreview } from "./demand-preview";
import { LocationPicker } from "./location-picker";
import { PhotoManager, type PhotoRecord } from "./photo-manager";
import { PickupWindowFields } from "./pickup-window-fields";
import { QualityFields } from "./quality-fields";
import { Form } from "@/components/ui/form";

const UNIT_NAMES: Record<string, string> = { sheets: "sheets", m2: "area", bags: "bags", m3: "volume", bales: "bales", kg: "weight" };

type Props =
  | { mode: "create"; unitSystem: UnitSystem; canSellWorms: boolean }
  | { mode: "edit"; unitSystem: UnitSystem; canSellWorms: boolean; listingId: string; initial: ListingFormState; photos: PhotoRecord[] };

/** Where the summary's link for a field goes: the place search for the map point, a group's first control. */
function listingErrorTarget(path: string): string | undefined {
  if (path === "location" || path.startsWith("location.")) return "field-location";
  const win = /^pickup_windows\.(\d+)/.exec(path);
  if (win) return `pickup-window-${win[1]}-error`;
  if (path === "pickup_windows") return "pickup-windows-error";
  if (path === "quality.herbicide_history" || path === "quality.leaf_source") return `${path.replace(".", "-")}-error`;
  if (path === "quality.species") return "field-species";
  if (path === "photos" || path.startsWith("photos.")) return "photos-error";
  return undefined;
}

export function ListingForm(props: Props) {
  const router = useRouter();
  const system = props.unitSystem;
  // The form holds what people type, in their units; the shared schema checks the API body.
  const schemaResolver = zodResolver(createListingSchema);
  const resolver: Resolver<ListingFormState> = (values, context, options) =>
    schemaResolver(toBody(values, system) as never, context, options as never) as never;
  // The error summary takes the focus on a failed submit (react-hook-form would move it to the first field).
  const form = useForm<ListingFormState>({ resolver, defaultValues: props.mode === "edit" ? props.initial : emptyForm(), shouldFocusError: false });
  const { register, setValue, formState } = form;
  const errors = formState.errors;
  const [material, unit, priced, location] = useWatch({ control: form.control, name: ["material", "unit", "priced", "location"] });
  const units = UNITS_BY_MATERIAL[material];
  const sizeField = unitSizeField(unit, system);
  const symbol = quantitySymbol(unit, system);

  useEffect(() => {
    if (!units.includes(unit)) setValue("unit", units[0]);
  }, [material, unit, units, setValue]);

  const summary = useErrorSummary(form, { target: listingErrorTarget });

  const onSubmit = form.handleSubmit(async (parsed) => {
    summary.clear();
    const body = parsed as unknown as CreateListingInput;
    try {
      let id: string;
      if (props.mode === "create") {
        id = (await apiFetch<{ listing: { id: string } }>("/api/listings", { method: "POST", body })).listing.id;
      } else {
        const { status: _s, photos: _p, material: _m, ...patch } = body;
        id = props.listingId;
        await apiFetch(`/api/listings/${id}`, { method: "PATCH", body: patch });
      }
      router.push(`/listings/${id}`);
      router.refresh();
    } catch (err) {
      summary.fail(err, "Saving failed. Please try again.");
    }
  }, summary.invalid);

  const submitAs = (status: "active" | "draft") => () => setValue("status", status);
  const locationError = errors.location?.message ?? errors.location?.lat?.message ?? errors.location?.lng?.message;

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-8">
      <ErrorSummary {...summary.props} title="The listing needs another look" />

      <section className="flex flex-col gap-3" aria-labelledby="what-title">
        <h2 id="what-title" className="text-xl font-semibold">What you have</h2>
        {props.mode === "create" ? (
          <SelectField label="Material" {...register("material")} error={errors.material?.message}>
            {MATERIAL_CODES.filter((m) => m !== "worms" || props.canSellWorms).map((m) => (
              <option key={m} value={m}>
                {MATERIALS[m].name}
              </option>
            ))}
          </SelectField>
        ) : (
          <p>
            <span className="font-medium">Material:</span> {MATERIALS[material].name}{" "}
            <span className="text-sm text-humus-600">(to offer something else, post a new listing)</span>
          </p>
        )}
        <Field label="Title" {...register("title")} error={errors.title?.message} placeholder="e.g. Eight bags of raked oak leaves" />
        <TextAreaField label="Description" {...register("description")} error={errors.description?.message} rows={4} hint="How it is stored, how to get to it, anything a collector should bring." />
      </section>

      <section className="flex flex-col gap-3" aria-labelledby="amount-title">
        <h2 id="amount-title" className="text-xl font-semibold">How much</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField label="Counted by" {...register("unit")} error={errors.unit?.message}>
            {units.map((u) => (
              <option key={u} value={u}>
                {u === "sheets" || u === "bags" || u === "bales" ? UNIT_NAMES[u] : `${UNIT_NAMES[u]} (${quantitySymbol(u, system)})`}
              </option>
            ))}
          </SelectField>
          <Field label={`Quantity (${symbol})`} inputMode="decimal" {...register("quantity")} error={errors.quantity?.message} />
          {sizeField ? (
            <Field label={`${sizeField.label} (${sizeField.symbol})`} inputMode="decimal" {...register("unit_size")} error={errors.unit_size?.message} placeholder={unitSizePlaceholder(unit, system, material)} hint={defaultUnitSize(unit, material) === null ? "Measure one: only straw bales come in a usual size." : "Leave empty for the usual size."} />
          ) : null}
          {unit === "bales" ? (
            <Field label={`Weight of one bale (${system === "imperial" ? "lb" : "kg"})`} inputMode="decimal" {...register("unit_mass_kg")} error={errors.unit_mass_kg?.message} hint="Tells collectors how heavy a lift it is." />
          ) : null}
          <Field label={`Most one person can take (${symbol}, optional)`} inputMode="decimal" {...register("max_per_reservation")} error={errors.max_per_reservation?.message} />
        </div>
      </section>

      <section className="flex flex-col gap-3" aria-labelledby="price-title">
        <h2 id="price-title" className="text-xl font-semibold">Price</h2>
        <fieldset className="flex flex-wrap gap-4">
          <legend className="sr-only">Free or priced</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="free" {...register("priced")} className="h-5 w-5" /> Free
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="priced" {...register("priced")} className="h-5 w-5" /> {material === "worms" ? `For a price a ${symbol}` : "For a price"}
          </label>
          {material === "worms" ? (
            <label className="flex items-center gap-2">
              <input type="radio" value="per_pack" {...register("priced")} className="h-5 w-5" /> For a price a pack
            </label>
          ) : null}
        </fieldset>
        {/* Boxes bottom-aligned side by side, whichever field carries a hint above its box. */}
        <div className="grid gap-3 sm:grid-cols-3 sm:items-end">
          {priced === "per_pack" && material === "worms" ? (
            <>
              <Field label={`Weight of one pack (${symbol})`} inputMode="decimal" {...register("pack_size")} error={errors.pack_size?.message} hint="Buyers reserve whole packs; the quantity above is the total across all packs." />
              <Field label="Price of one pack" inputMode="decimal" {...register("pack_price_cents")} error={errors.pack_price_cents?.message} />
            </>
          ) : null}
          {priced === "priced" || (priced === "per_pack" && material === "worms") ? (
            <>
              {priced === "priced" ? (
                <Field label={`Price for each ${unit === "m3" || unit === "m2" || unit === "kg" ? symbol : unit.replace(/s$/, "")}`} inputMode="decimal" {...register("price_cents")} error={errors.price_cents?.message} />
              ) : null}
              <SelectField label="Currency" {...register("currency")} error={errors.currency?.message}>
                <option value="eur">EUR</option>
                <option value="gbp">GBP</option>
                <option value="usd">USD</option>
              </SelectField>
            </>
          ) : null}
          <Field label="No-show deposit (optional)" inputMode="decimal" {...register("deposit_cents")} error={errors.deposit_cents?.message} hint="Refunded when they collect; kept if they do not turn up." />
        </div>
        <label className="flex items-center gap-2">
          <input type="checkbox" {...register("auto_accept")} className="h-5 w-5" /> Accept requests without asking me
        </label>
      </section>

      <section className="flex flex-col gap-3" aria-labelledby="quality-title">
        <h2 id="quality-title" className="text-xl font-semibold">About the material</h2>
        <QualityFields form={form} material={material} />
      </section>

      <section className="flex flex-col gap-4" aria-labelledby="where-title">
        <h2 id="where-title" className="text-xl font-semibold">Where and when</h2>
        <LocationPicker value={location} onChange={(p) => setValue("location", p, { shouldValidate: formState.isSubmitted })} error={locationError} />
        <DemandPreview material={material} location={location} system={system} />
        <Field label="Pickup address" {...register("address")} error={errors.address?.message} hint="Shown only to people whose reservation you confirm." autoComplete="street-address" />
        <div className="grid gap-3 sm:grid-cols-2">
          <Field label="Available from (optional)" type="date" {...register("available_from")} error={errors.available_from?.message} />
          <Field label="Available until (optional)" type="date" {...register("available_until")} error={errors.available_until?.message} />
        </div>
        <PickupWindowFields form={form} />
      </section>

      <section className="flex flex-col gap-3" aria-labelledby="photos-title">
        <h2 id="photos-title" className="text-xl font-semibold">Photos</h2>
        {props.mode === "create" ? (
          <PhotoManager mode="create" onChange={(photos) => setValue("photos", photos)} />
        ) : (
          <PhotoManager mode="edit" listingId={props.listingId} initial={props.photos} />
        )}
        <GroupError id="photos-error" error={errors.photos?.message} />
      </section>

      <div className="flex flex-wrap gap-3 border-t border-humus-200 pt-4">
        {props.mode === "create" ? (
          <>
            <Button type="submit" onClick={submitAs("active")} disabled={formState.isSubmitting}>
              {formState.isSubmitting ? "Posting…" : "Publish listing"}
            </Button>
            <Button type="submit" variant="secondary" onClick={submitAs("draft")} disabled={formState.isSubmitting}>
              Save as draft
            </Button>
          </>
        ) : (
          <Button type="submit" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Saving…" : "Save changes"}
          </Button>
        )}
      </div>
    </Form>
  );
}
