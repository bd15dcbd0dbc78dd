"use client";
import { useEffect, useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { apiFetch, isApiError } from "@/lib/api/client";
import type { EstimateResult } from "@/lib/calc/estimate";
import type { UnitSystem } from "@/lib/calc/units";
import { DuffMap } from "@/components/map/map";
import { DEFAULT_CENTER } from "@/components/map/types";
import { Field } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { Spinner } from "@/components/ui/empty-state";
import { convertValues, defaultPlanValues, planResolver, toRequest, type PlanValues } from "./form-model";
import { EstimateView, type ShownEstimate } from "./estimate-view";
import { DEFAULT_RADIUS_KM } from "@/lib/match/defaults";
import { UnitSwitch } from "@/components/ui/unit-switch";
import { useUnits } from "@/components/ui/units-context";
import { SaveBed } from "./save-bed";
import { Form } from "@/components/ui/form";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";

export interface PlanFormProps {
  system: UnitSystem;
  today: string;
  /** Signed-in gardeners can save; `bed` means editing that saved bed. */
  canSave: boolean;
  bed?: { id: string; name: string; values: PlanValues };
  /** The gardener's home place (profile), where matching starts when the bed has no place. */
  home?: { lat: number; lng: number } | null;
}

/** Builds the link to the match page from the estimate's needs. */
function matchHref(result: EstimateResult, where: { lat: number; lng: number; label?: string } | null): string {
  const needs = result.needs.map((n) => `${n.material}:${n.quantity}:${n.unit}`).join(",");
  const p = new URLSearchParams({ needs, radius_km: String(DEFAULT_RADIUS_KM) });
  if (where) {
    p.set("lat", String(where.lat));
    p.set("lng", String(where.lng));
    if (where.label) p.set("place", where.label);
  }
  return `/match?${p}`;
}

// The usual values beside each field, in the reader's own units (common practice, as in
// lib/calc/facts.ts; the imperial figures are the ones gardeners quote, not conversions).
const HINTS: Record<UnitSystem, Record<"overlap" | "sheet_length" | "sheet_width" | "leaves" | "straw" | "chips" | "worms", string>> = {
  metric: {
    overlap: "Usually about 15 cm.",
    sheet_length: "Blank for 100 cm.",
    sheet_width: "Blank for 80 cm.",
    leaves: "Usually 10–15 cm.",
    straw: "Usually about 5 cm.",
    chips: "Usually about 7.5 cm.",
    worms: "Blank for about 0.5 kg/m².",
  },
  imperial: {
    overlap: "Usually about 6 in.",
    sheet_length: "Blank for 39 in.",
    sheet_width: "Blank for 31.5 in.",
    leaves: "Usually 4–6 in.",
    straw: "Usually about 2 in.",
    chips: "Usually about 3 in.",
    worms: "Blank for about 1.6 oz/ft².",
  },
};

export function PlanForm({ system: initialSystem, today, canSave, bed, home = null }: PlanFormProps) {
  const resolver = useMemo(() => planResolver(), []);
  const form = useForm<PlanValues>({ resolver, defaultValues: bed?.values ?? defaultPlanValues(initialSystem, today) });
  const { register, setValue, getValues, formState, control } = form;
  const [system, shape, outline, location, cardboardOn, leavesOn, strawOn, chipsOn, wormsOn] = useWatch({
    control,
    name: ["system", "shape", "outline", "location", "cardboard_on", "leaves_on", "straw_on", "chips_on", "worms_on"],
  });

  const estimate = useMutation({
    mutationFn: (values: PlanValues) => {
      // With a place for the bed, the estimate also prices it from the nearest listings.
      const at = values.shape === "outline" ? values.outline[0] : values.location;
      const body = { ...toRequest(values), ...(at ? { match: { origin: at, radius_km: DEFAULT_RADIUS_KM } } : {}) };
      return apiFetch<ShownEstimate>("/api/estimate", { method: "POST", body });
    },
  });

  // The advice and the timeline are written in the units asked for, so a shown estimate is
  // asked for again in the new ones.
  const switchUnits = (u: UnitSystem) => {
    form.reset(convertValues(getValues(), getValues("system"), u), { keepErrors: false });
    if (estimate.data) void form.handleSubmit((v) => estimate.mutate(v))();
  };
  // The one unit switch (in the header, and beside the form) drives the planner's units.
  const { system: viewerSystem } = useUnits();
  useEffect(() => {
    if (viewerSystem !== getValues("system")) switchUnits(viewerSystem);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [viewerSystem]);

  // Where the bed is, found by name (or "where I am"): the rectangle's point, or where the
  // map goes to draw the outline.
  const [place, setPlace] = useState<ChosenPlace | null>(null);
  const findPlace = (p: ChosenPlace) => {
    setPlace(p);
    if (getValues("shape") === "rectangle") setValue("location", { lat: p.lat, lng: p.lng });
  };
  const onMapClick = (p: { lat: number; lng: number }) => {
    if (getValues("shape") === "outline") setValue("outline", [...getValues("outline"), p], { shouldValidate: formState.isSubmitted });
    else setValue("location", p);
  };

  const unitLen = system === "metric" ? "m" : "ft";
  const unitDepth = system === "metric" ? "cm" : "in";
  const unitStocking = system === "metric" ? "kg/m²" : "oz/ft²";
  const errors = formState.errors;
  const result = estimate.data;
  const where = shape === "outline" && outline.length ? outline[0] : location;

  return (
    <div className="grid grid-cols-1 gap-8 lg:grid-cols-[minmax(0,420px)_minmax(0,1fr)]">
      <Form onSubmit={form.handleSubmit((v) => estimate.mutate(v))} noValidate className="flex flex-col gap-4" aria-label="Bed planner">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 className="text-lg font-semibold">The bed</h2>
          <UnitSwitch />
        </div>
        <fieldset className="flex gap-4">
          <legend className="sr-only">Shape</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="rectangle" {...register("shape")} className="h-5 w-5" /> Length × width
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="outline" {...register("shape")} className="h-5 w-5" /> Draw it on the map
          </label>
        </fieldset>

        {shape === "rectangle" ? (
          <div className="grid grid-cols-2 gap-3">
            <Field label={`Length (${unitLen})`} inputMode="decimal" {...register("length")} error={errors.length?.message} />
            <Field label={`Width (${unitLen})`} inputMode="decimal" {...register("width")} error={errors.width?.message} />
          </div>
        ) : null}

        <div className="flex flex-col gap-2">
          <PlaceSearch
            label="Where the bed is"
            name="bed_place"
            hint={shape === "outline" ? "Find the street or postcode; the map goes there for you to draw." : "Optional: a street, village or postcode, to find material near it."}
            value={place ?? (location && shape === "rectangle" ? { ...location, label: "The point on the map" } : null)}
            onChange={findPlace}
          />
          <DuffMap
            // A map takes its zoom only when it mounts: a fresh one per shape, so drawing starts close in.
            key={shape}
            label={shape === "outline" ? "Map: click each corner of the bed" : "Map: click where the bed is"}
            center={where ?? place ?? DEFAULT_CENTER}
            zoom={shape === "outline" ? 17 : 13}
            view={place ? { lat: place.lat, lng: place.lng, zoom: shape === "outline" ? 18 : 15 } : undefined}
            polygon={shape === "outline" ? outline : undefined}
            markers={shape === "rectangle" && location ? [{ id: "bed", ...location, label: "The bed", tone: "origin" }] : []}
            onClick={onMapClick}
            centrePick={{ label: shape === "outline" ? "Add a corner at the cross" : "Put the bed at the cross", onPick: onMapClick }}
            className="h-72"
          />
          {shape === "outline" ? (
            <div className="flex flex-wrap items-center gap-2 text-sm">
              <span>{outline.length} corners placed.</span>
              <Button variant="secondary" onClick={() => setValue("outline", outline.slice(0, -1))} disabled={!outline.length}>
                Undo last corner
              </Button>
              <Button variant="secondary" onClick={() => setValue("outline", [])} disabled={!outline.length}>
                Start again
              </Button>
            </div>
          ) : (
            <p className="text-sm text-humus-600">{location ? "Bed placed on the map: matching will search from here." : "Optional: find the place above, or click the map where the bed is, to find material near it."}</p>
          )}
          <p id="field-outline-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
            {errors.outline?.message ?? ""}
          </p>
        </div>

        <fieldset className="flex flex-col gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200">
          <legend className="px-1 font-semibold">Layers, bottom to top</legend>
          <LayerSwitch label="Cardboard" {...register("cardboard_on")} />
          {cardboardOn ? (
            <>
              <Field label={`Seam overlap (${unitDepth})`} hint={HINTS[system].overlap} inputMode="decimal" {...register("overlap")} error={errors.overlap?.message} />
              <div className="grid grid-cols-2 gap-3">
                <Field label={`Sheet length (${unitDepth})`} hint={HINTS[system].sheet_length} inputMode="decimal" {...register("sheet_length")} error={errors.sheet_length?.message} />
                <Field label={`Sheet width (${unitDepth})`} hint={HINTS[system].sheet_width} inputMode="decimal" {...register("sheet_width")} error={errors.sheet_width?.message} />
              </div>
            </>
          ) : null}
          <LayerSwitch label="Leaves" {...register("leaves_on")} />
          {leavesOn ? (
            <Field label={`Leaf depth (${unitDepth})`} hint={HINTS[system].leaves} inputMode="decimal" {...register("leaves_depth")} error={errors.leaves_depth?.message} />
          ) : null}
          <LayerSwitch label="Straw on top" {...register("straw_on")} />
          {strawOn ? (
            <Field label={`Straw depth (${unitDepth})`} hint={HINTS[system].straw} inputMode="decimal" {...register("straw_depth")} error={errors.straw_depth?.message} />
          ) : null}
          <LayerSwitch label="Wood chips" {...register("chips_on")} />
          {chipsOn ? (
            <Field label={`Wood chip depth (${unitDepth})`} hint={HINTS[system].chips} inputMode="decimal" {...register("chips_depth")} error={errors.chips_depth?.message} />
          ) : null}
          <LayerSwitch label="Composting worms, a week or two later" {...register("worms_on")} />
          {wormsOn ? (
            <Field
              label={`Worms to stock (${unitStocking})`}
              hint={HINTS[system].worms}
              inputMode="decimal"
              {...register("worms_stocking")}
              error={errors.worms_stocking?.message}
            />
          ) : null}
        </fieldset>

        <Field label="Build day" type="date" {...register("start_date")} error={errors.start_date?.message} />

        <Button type="submit" disabled={estimate.isPending}>
          {estimate.isPending ? "Working it out…" : "Work out what it takes"}
        </Button>
      </Form>

      <section aria-labelledby="result-title" className="flex min-w-0 flex-col gap-4">
        <h2 id="result-title" className="text-lg font-semibold">
          What your bed needs
        </h2>
        {estimate.isPending ? <Spinner label="Working it out" /> : null}
        {estimate.isError ? (
          <Notice tone="error">{isApiError(estimate.error) ? estimate.error.message : "The estimate could not be made. Please try again."}</Notice>
        ) : null}
        {!result && !estimate.isPending && !estimate.isError ? (
          <p className="rounded-leaf border border-dashed border-humus-300 p-6 text-humus-700">
            Give the bed&apos;s size and layers, then press <strong>Work out what it takes</strong>. You will get the amount of each layer, the water for the first soak, how fast
            it will break down, and a year of checks.
          </p>
        ) : null}
        {result ? (
          <>
            <div className="flex flex-wrap gap-3">
              <Link className={buttonClass("secondary")} href={bed ? `/beds/${bed.id}/materials` : matchHref(result, where ? { ...where, label: place && shape === "rectangle" ? place.label : "The bed on the map" } : (result.centroid ?? home))}>
                Find these materials nearby
              </Link>
            </div>
            {canSave ? <SaveBed request={toRequest(getValues())} location={where ?? null} bed={bed} /> : null}
            {!canSave ? (
              <p className="text-sm text-humus-700">
                <Link href="/sign-in?callbackUrl=%2Fplan" className="text-moss-700 underline">Sign in</Link> to save this bed and get its reminders by e-mail.
              </p>
            ) : null}
            <EstimateView
              result={result}
              system={system}
              costsHint={result.costs ? undefined : "Say where the bed is (a street or postcode above, or a click on the map) to see what it will cost from the nearest listings: what is free, what a deposit holds, what is paid for."}
            />
          </>
        ) : null}
      </section>
    </div>
  );
}

function LayerSwitch({ label, ...props }: { label: string } & React.InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className="flex items-center gap-3 font-medium">
      <input type="checkbox" className="h-5 w-5" {...props} /> {label}
    </label>
  );
}
