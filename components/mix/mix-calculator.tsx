"use client";
import { useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { useMutation } from "@tanstack/react-query";
import { blendSchema, type BlendInput } from "@/lib/validation/blend";
import { apiFetch, isApiError } from "@/lib/api/client";
import { MATERIAL_CODES, MATERIALS, CN_RATIO, MOISTURE_PCT, type MaterialCode } from "@/lib/calc/facts";
import { mixUnitKg, mixUnitsFor, type MixUnit } from "@/lib/calc/mix-amounts";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { CnBand } from "@/components/planner/cn-band";
import { Form } from "@/components/ui/form";
import { BalancePicture } from "./balance-picture";
import { MaterialTiles } from "./material-tiles";
import { MixRow, type MixRowValues } from "./mix-row";
import { WetnessGauge } from "./wetness-gauge";
import { inputClass } from "@/components/ui/field";

export interface MixValues {
  components: MixRowValues[];
  target_moisture_pct?: number;
}

interface BlendResult {
  cn_ratio: number;
  moisture_pct: number;
  dry_mass_kg: number;
  carbon_kg: number;
  nitrogen_kg: number;
  water_to_target_l?: number;
  /** What would bring the mix into the composting range, by mass; null inside it. */
  advice: string | null;
}

export const COMPOSTING = MATERIAL_CODES.filter((c) => c !== "worms");
const firstUnit = (m: MaterialCode | undefined): MixUnit => (m === "straw" ? "bales" : m ? "buckets" : "kg");

/** Each row's amount in kg as is: what POST /api/blend takes. The blend itself is computed there, unchanged. */
export function toBlendInput(v: MixValues): BlendInput {
  return {
    components: v.components.map((c) => {
      const per = mixUnitKg(c.material, c.unit) ?? NaN;
      return {
        material: c.material,
        mass_kg: Number.isFinite(c.amount) ? Math.round(c.amount * per * 1000) / 1000 : NaN,
        ...(c.moisture_pct !== undefined ? { moisture_pct: c.moisture_pct } : {}),
        ...(c.n_pct !== undefined ? { n_pct: c.n_pct } : {}),
        ...(c.cn_ratio !== undefined ? { cn_ratio: c.cn_ratio } : {}),
      };
    }),
    ...(v.target_moisture_pct !== undefined ? { target_moisture_pct: v.target_moisture_pct } : {}),
  };
}

const FIELD_OF: Record<string, keyof MixRowValues> = { mass_kg: "amount", moisture_pct: "moisture_pct", n_pct: "n_pct", cn_ratio: "cn_ratio", c_pct: "cn_ratio", material: "material" };

export function MixCalculator() {
  const [figures, setFigures] = useState(false);
  const form = useForm<MixValues>({
    defaultValues: {
      components: [
        { material: "leaves", amount: 2, unit: "barrows" },
        { material: "grass_clippings", amount: 1, unit: "buckets" },
      ],
      target_moisture_pct: MOISTURE_PCT.target,
    },
  });
  const rows = useFieldArray({ control: form.control, name: "components" });
  const mix = useMutation({ mutationFn: (v: BlendInput) => apiFetch<BlendResult>("/api/blend", { method: "POST", body: v }) });
  const chosen = useWatch({ control: form.control, name: "components" }) ?? [];
  const [sent, setSent] = useState<BlendInput | null>(null);

  const submit = form.handleSubmit((values) => {
    form.clearErrors();
    const body = toBlendInput(values);
    // The handler's own schema, so the messages here are the ones the server would give.
    const parsed = blendSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [top, index, field] = issue.path;
        if (top === "components" && typeof index === "number" && typeof field === "string") {
          form.setError(`components.${index}.${FIELD_OF[field] ?? "amount"}` as `components.${number}.amount`, { message: issue.message });
          if (FIELD_OF[field] !== "amount" && FIELD_OF[field] !== "material") setFigures(true);
        } else if (top === "target_moisture_pct") form.setError("target_moisture_pct", { message: issue.message });
      }
      return;
    }
    setSent(parsed.data);
    mix.mutate(parsed.data);
  });

  const toggle = (m: MaterialCode | undefined) => {
    const at = chosen.findIndex((c) => c.material === m);
    if (at >= 0 && m !== undefined) rows.remove(at);
    else rows.append({ material: m, amount: 1, unit: firstUnit(m) });
  };

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_400px]">
      <Form onSubmit={submit} noValidate className="flex flex-col gap-5" aria-label="Mix calculator">
        <MaterialTiles chosen={chosen.map((c) => c.material)} onToggle={toggle} />
        <section aria-labelledby="amounts-title" className="flex flex-col gap-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="amounts-title" className="text-lg font-semibold">
              How much of each
            </h2>
            <button type="button" aria-expanded={figures} aria-controls="mix-rows" onClick={() => setFigures((f) => !f)} className="min-h-11 rounded-lg px-3 text-sm font-medium text-moss-800 ring-1 ring-moss-300 hover:bg-moss-50">
              {figures ? "Hide the figures" : "Show the figures"}
              <span aria-hidden="true" className={`ml-2 inline-block transition ${figures ? "rotate-180" : ""}`}>
                ▾
              </span>
            </button>
          </div>
          <ul id="mix-rows" className="flex flex-col gap-3">
            {rows.fields.map((f, i) => (
              <MixRow key={f.id} index={i} form={form} material={chosen[i]?.material} unit={chosen[i]?.unit} units={mixUnitsFor(chosen[i]?.material)} figures={figures} onRemove={rows.fields.length > 1 ? () => rows.remove(i) : undefined} />
            ))}
          </ul>
          <p className="text-sm text-humus-700">
            A bucket is taken as 10 L and a barrow as 80 L; a bag as a 30-gallon paper leaf bag and a bale as a small two-string bale. Weigh it if you can: kg is always exact.
          </p>
        </section>
        <div className="flex flex-wrap items-end gap-3">
          {figures ? (
            <label className="flex flex-col text-sm font-medium">
              Target moisture %
              <input type="number" step="any" {...form.register("target_moisture_pct", { setValueAs: (v: string) => (v === "" || v === null ? undefined : Number(v)) })} className={`${inputClass} w-24`} />
            </label>
          ) : null}
          <Button type="submit" disabled={mix.isPending}>
            {mix.isPending ? "Mixing…" : "Work out the mix"}
          </Button>
        </div>
        {form.formState.errors.target_moisture_pct ? (
          <p role="alert" className="text-sm text-ember-600">
            {form.formState.errors.target_moisture_pct.message}
          </p>
        ) : null}
      </Form>
      <section aria-labelledby="mix-result" aria-live="polite" className="flex flex-col gap-3">
        <h2 id="mix-result" className="text-lg font-semibold">
          The mix
        </h2>
        {mix.isError ? <Notice tone="error">{isApiError(mix.error) ? mix.error.message : "That did not work."}</Notice> : null}
        {mix.data && sent ? (
          <>
            <BalancePicture
              cn={mix.data.cn_ratio}
              parts={sent.components.map((c) => ({ material: c.material, kg: c.mass_kg, cn: c.cn_ratio ?? (c.material ? (MATERIALS[c.material].cn_ratio ?? undefined) : undefined) }))}
            />
            <p className="rounded-lg bg-litter-100 p-3 text-sm text-humus-900" data-testid="mix-advice">
              {mix.data.advice ?? `Inside the composting range (${CN_RATIO.ideal_min}–${CN_RATIO.ideal_max}): nothing to add.`}
            </p>
            <WetnessGauge pct={mix.data.moisture_pct} target={sent.target_moisture_pct} />
            {mix.data.water_to_target_l !== undefined && mix.data.water_to_target_l > 0 ? (
              <p className="text-sm">
                To bring it to {sent.target_moisture_pct} %: add about <strong>{mix.data.water_to_target_l.toFixed(1)} L</strong> of water, a little at a time.
              </p>
            ) : null}
            {figures ? (
              <>
                <CnBand value={mix.data.cn_ratio} />
                <dl className="grid grid-cols-2 gap-2 text-sm">
                  <dt>Carbon : nitrogen</dt>
                  <dd className="font-bold">{mix.data.cn_ratio.toFixed(1)} : 1</dd>
                  <dt>Moisture</dt>
                  <dd className="font-bold">{mix.data.moisture_pct.toFixed(1)} %</dd>
                  <dt>Weight as is</dt>
                  <dd>{sent.components.reduce((s, c) => s + c.mass_kg, 0).toFixed(1)} kg</dd>
                  <dt>Dry matter</dt>
                  <dd>{mix.data.dry_mass_kg.toFixed(2)} kg</dd>
                  <dt>Carbon</dt>
                  <dd>{mix.data.carbon_kg.toFixed(2)} kg</dd>
                  <dt>Nitrogen</dt>
                  <dd>{mix.data.nitrogen_kg.toFixed(3)} kg</dd>
                  {mix.data.water_to_target_l !== undefined ? (
                    <>
                      <dt>Water to add</dt>
                      <dd className="font-bold">{mix.data.water_to_target_l.toFixed(1)} L</dd>
                    </>
                  ) : null}
                </dl>
              </>
            ) : null}
          </>
        ) : (
          <p className="text-humus-700">
            Pick what you have, say how much in buckets, barrows, bags, bales or kg, and press <strong>Work out the mix</strong>.
          </p>
        )}
        <Notice tone="caution">Grass clippings, manure and compost can carry weedkiller residues that harm garden plants; ask where they came from. Wear gloves.</Notice>
      </section>
    </div>
  );
}
