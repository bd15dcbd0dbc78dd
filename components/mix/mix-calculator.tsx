"use client";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { z } from "zod";
import { blendSchema } from "@/lib/validation/blend";
import { apiFetch, isApiError } from "@/lib/api/client";
import { MATERIAL_CODES, MATERIALS, CN_RATIO, MOISTURE_PCT } from "@/lib/calc/facts";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { CnBand } from "@/components/planner/cn-band";
import { Form } from "@/components/ui/form";

type Values = z.input<typeof blendSchema>;
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

const COMPOSTING = MATERIAL_CODES.filter((c) => c !== "worms");
// Number inputs: an empty box means "use the table's value".
const optionalNumber = { setValueAs: (v: string) => (v === "" || v === null ? undefined : Number(v)) };

export function MixCalculator() {
  const form = useForm<Values>({
    resolver: zodResolver(blendSchema),
    defaultValues: { components: [{ material: "leaves", mass_kg: 20 }, { material: "grass_clippings", mass_kg: 10 }], target_moisture_pct: MOISTURE_PCT.target },
  });
  const rows = useFieldArray({ control: form.control, name: "components" });
  const mix = useMutation({ mutationFn: (v: Values) => apiFetch<BlendResult>("/api/blend", { method: "POST", body: v }) });
  const errs = form.formState.errors.components;
  const chosen = useWatch({ control: form.control, name: "components" });

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_380px]">
      <Form onSubmit={form.handleSubmit((v) => mix.mutate(v))} noValidate className="flex flex-col gap-4" aria-label="Mix calculator">
        <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-humus-200">
          <table className="w-full text-left text-sm">
            <thead className="bg-humus-100">
              <tr>
                <th scope="col" className="p-2">Material</th>
                <th scope="col" className="p-2">Mass (kg, as is)</th>
                <th scope="col" className="p-2">Moisture %</th>
                <th scope="col" className="p-2">N % (dry)</th>
                <th scope="col" className="p-2">C:N</th>
                <th scope="col" className="p-2"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {rows.fields.map((f, i) => {
                const material = chosen?.[i]?.material;
                const facts = material ? MATERIALS[material] : undefined;
                const e = errs?.[i];
                const msg = e?.mass_kg?.message ?? e?.moisture_pct?.message ?? e?.n_pct?.message ?? e?.cn_ratio?.message ?? e?.material?.message;
                return (
                  <tr key={f.id} className="border-t border-humus-100 align-top">
                    <td className="p-2">
                      <select aria-label={`Material ${i + 1}`} {...form.register(`components.${i}.material`, { setValueAs: (v) => v || undefined })} className="min-h-10 rounded border border-humus-300 bg-white px-2">
                        <option value="">Something else</option>
                        {COMPOSTING.map((c) => (
                          <option key={c} value={c}>{MATERIALS[c].name}</option>
                        ))}
                      </select>
                      {msg ? <p role="alert" className="mt-1 text-xs text-ember-600">{msg}</p> : null}
                    </td>
                    <td className="p-2"><input aria-label={`Mass ${i + 1} in kg`} type="number" step="any" {...form.register(`components.${i}.mass_kg`, { valueAsNumber: true })} className="w-24 rounded border border-humus-300 px-2 py-1" /></td>
                    <td className="p-2"><input aria-label={`Moisture ${i + 1}`} type="number" step="any" placeholder={facts ? String(facts.moisture_pct) : ""} {...form.register(`components.${i}.moisture_pct`, optionalNumber)} className="w-20 rounded border border-humus-300 px-2 py-1" /></td>
                    <td className="p-2"><input aria-label={`Nitrogen ${i + 1}`} type="number" step="any" placeholder={facts?.n_pct != null ? String(facts.n_pct) : ""} {...form.register(`components.${i}.n_pct`, optionalNumber)} className="w-20 rounded border border-humus-300 px-2 py-1" /></td>
                    <td className="p-2"><input aria-label={`C:N ${i + 1}`} type="number" step="any" placeholder={facts?.cn_ratio != null ? String(facts.cn_ratio) : ""} {...form.register(`components.${i}.cn_ratio`, optionalNumber)} className="w-20 rounded border border-humus-300 px-2 py-1" /></td>
                    <td className="p-2"><Button variant="quiet" onClick={() => rows.remove(i)} aria-label={`Remove material ${i + 1}`} disabled={rows.fields.length === 1}>Remove</Button></td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <p className="text-sm text-humus-600">Empty boxes take the figure from our materials table (greyed in). Values for finished compost vary too much to guess: give your own.</p>
        <div className="flex flex-wrap items-end gap-3">
          <Button variant="secondary" onClick={() => rows.append({ material: "straw", mass_kg: 5 })}>Add a material</Button>
          <label className="flex flex-col text-sm font-medium">
            Target moisture %
            <input type="number" step="any" {...form.register("target_moisture_pct", optionalNumber)} className="w-24 rounded border border-humus-300 px-2 py-1" />
          </label>
          <Button type="submit" disabled={mix.isPending}>{mix.isPending ? "Mixing…" : "Work out the mix"}</Button>
        </div>
        {form.formState.errors.target_moisture_pct ? <p role="alert" className="text-sm text-ember-600">{form.formState.errors.target_moisture_pct.message}</p> : null}
      </Form>
      <section aria-labelledby="mix-result" aria-live="polite" className="flex flex-col gap-3">
        <h2 id="mix-result" className="text-lg font-semibold">The mix</h2>
        {mix.isError ? <Notice tone="error">{isApiError(mix.error) ? mix.error.message : "That did not work."}</Notice> : null}
        {mix.data ? (
          <>
            <CnBand value={mix.data.cn_ratio} />
            <dl className="grid grid-cols-2 gap-2 text-sm">
              <dt>Carbon : nitrogen</dt><dd className="font-bold">{mix.data.cn_ratio.toFixed(1)} : 1</dd>
              <dt>Moisture</dt><dd className="font-bold">{mix.data.moisture_pct.toFixed(1)} %</dd>
              <dt>Dry matter</dt><dd>{mix.data.dry_mass_kg.toFixed(2)} kg</dd>
              <dt>Carbon</dt><dd>{mix.data.carbon_kg.toFixed(2)} kg</dd>
              <dt>Nitrogen</dt><dd>{mix.data.nitrogen_kg.toFixed(3)} kg</dd>
              {mix.data.water_to_target_l !== undefined ? (<><dt>Water to add</dt><dd className="font-bold">{mix.data.water_to_target_l.toFixed(1)} L</dd></>) : null}
            </dl>
            <p className="text-sm text-humus-700" data-testid="mix-advice">
              {mix.data.advice ?? `Inside the composting range (${CN_RATIO.ideal_min}–${CN_RATIO.ideal_max}).`}
            </p>
          </>
        ) : (
          <p className="text-humus-700">Add what you have by weight and press <strong>Work out the mix</strong>.</p>
        )}
        <Notice tone="caution">Grass clippings, manure and compost can carry weedkiller residues that harm garden plants; ask where they came from. Wear gloves.</Notice>
      </section>
    </div>
  );
}
