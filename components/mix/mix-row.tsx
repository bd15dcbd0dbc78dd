import type { UseFormReturn } from "react-hook-form";
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { mixUnitKg, type MixUnit } from "@/lib/calc/mix-amounts";
import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";
import type { MixValues } from "./mix-calculator";

export interface MixRowValues {
  material: MaterialCode | undefined;
  amount: number;
  unit: MixUnit;
  moisture_pct?: number;
  n_pct?: number;
  cn_ratio?: number;
}

const UNIT_WORDS: Record<MixUnit, string> = { buckets: "buckets (10 L)", barrows: "barrows (80 L)", bags: "leaf bags", bales: "small bales", kg: "kg" };
// Number inputs: an empty box means "use the table's value".
const optionalNumber = { setValueAs: (v: string) => (v === "" || v === null ? undefined : Number(v)) };
const box = "min-h-11 rounded-lg border border-humus-300 bg-white px-2";

/** One material in the mix: how much, in what, what that weighs, and (behind "figures") its composition and sources. */
export function MixRow({ index: i, form, material, unit, units, figures, onRemove }: { index: number; form: UseFormReturn<MixValues>; material: MaterialCode | undefined; unit: MixUnit | undefined; units: MixUnit[]; figures: boolean; onRemove?: () => void }) {
  const facts = material ? MATERIALS[material] : undefined;
  const name = facts?.name ?? "Your own material";
  const errs = form.formState.errors.components?.[i];
  const amount = form.watch(`components.${i}.amount`);
  const per = unit ? mixUnitKg(material, unit) : null;
  const kg = per !== null && Number.isFinite(amount) ? amount * per : null;
  const figureError = errs?.moisture_pct?.message ?? errs?.n_pct?.message ?? errs?.cn_ratio?.message;
  return (
    <li className="flex flex-col gap-2 rounded-leaf bg-white p-3 ring-1 ring-humus-200" data-testid="mix-row">
      <div className="flex flex-wrap items-center gap-3">
        <span aria-hidden="true" className="h-8 w-8 shrink-0 rounded-full" style={{ background: material ? MATERIAL_COLOURS[material] : PALETTE.humus[200] }} />
        <span className="min-w-32 flex-1 font-semibold">{name}</span>
        <input aria-label={`Amount of ${name.toLowerCase()}`} type="number" step="any" min="0" {...form.register(`components.${i}.amount`, { valueAsNumber: true })} aria-invalid={errs?.amount ? true : undefined} className={`${box} w-24`} />
        <select aria-label={`Counted in (${name.toLowerCase()})`} {...form.register(`components.${i}.unit`)} className={box}>
          {units.map((u) => (
            <option key={u} value={u}>
              {UNIT_WORDS[u]}
            </option>
          ))}
        </select>
        <span className="w-24 text-sm text-humus-700">{kg !== null && unit !== "kg" ? `≈ ${kg < 10 ? kg.toFixed(1) : kg.toFixed(0)} kg` : ""}</span>
        {onRemove ? (
          <button type="button" onClick={onRemove} className="min-h-11 rounded-lg px-3 text-sm font-medium text-humus-800 underline underline-offset-4 hover:bg-humus-100">
            Remove<span className="sr-only"> {name.toLowerCase()}</span>
          </button>
        ) : null}
      </div>
      {errs?.amount?.message || errs?.material?.message ? (
        <p role="alert" className="text-sm text-ember-600">
          {errs?.amount?.message ?? errs?.material?.message}
        </p>
      ) : null}
      {figures ? (
        <div className="flex flex-col gap-2 rounded-lg bg-humus-50 p-3 text-sm">
          <div className="flex flex-wrap gap-3">
            <label className="flex flex-col font-medium">
              Moisture %
              <input type="number" step="any" placeholder={facts ? String(facts.moisture_pct) : ""} {...form.register(`components.${i}.moisture_pct`, optionalNumber)} className={`${box} w-24`} />
            </label>
            <label className="flex flex-col font-medium">
              N % of dry matter
              <input type="number" step="any" placeholder={facts?.n_pct != null ? String(facts.n_pct) : ""} {...form.register(`components.${i}.n_pct`, optionalNumber)} className={`${box} w-24`} />
            </label>
            <label className="flex flex-col font-medium">
              C:N
              <input type="number" step="any" placeholder={facts?.cn_ratio != null ? String(facts.cn_ratio) : ""} {...form.register(`components.${i}.cn_ratio`, optionalNumber)} className={`${box} w-24`} />
            </label>
          </div>
          <p className="text-humus-700">{facts ? <>Empty boxes take the figures shown. Source: {facts.source}.</> : "Give all three figures for a material of your own."}</p>
          {figureError ? (
            <p role="alert" className="text-ember-600">
              {figureError}
            </p>
          ) : null}
        </div>
      ) : null}
    </li>
  );
}
