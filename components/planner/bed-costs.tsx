import { formatMoney } from "@/lib/format/money";
import type { MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { formatListingQuantity } from "@/lib/listings/format";
import type { BedCosts, MaterialCost } from "@/lib/match/costs";
import { materialNoun } from "@/lib/match/format";

/** "€45.00", "€3.00 deposit, back at pickup", "free": one material's share of the plan. */
export function materialCostText(m: MaterialCost | undefined): string | null {
  if (!m) return null;
  const parts: string[] = [];
  if (m.cost_cents > 0) parts.push(formatMoney(m.cost_cents, m.currency));
  if (m.deposit_cents > 0) parts.push(`${formatMoney(m.deposit_cents, m.currency)} deposit, back at pickup`);
  return parts.length ? parts.join(" + ") : "free";
}

export const costOf = (costs: BedCosts | undefined, material: MaterialCode) => costs?.by_material.find((m) => m.material === material);

/** What the bed will cost with the nearest pickups: paid, held as deposits, free. */
export function BedCostsView({ costs, system, note }: { costs: BedCosts; system: UnitSystem; note?: string }) {
  return (
    <section aria-labelledby="costs-title" className="flex flex-col gap-3" data-testid="bed-costs">
      <h3 id="costs-title" className="text-lg font-semibold">
        What it will cost
      </h3>
      {costs.totals.map((t) => (
        <dl key={t.currency} className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <Figure label="To pay suppliers" value={formatMoney(t.to_pay_cents, t.currency)} hint={`${t.paid_pickups} paid ${t.paid_pickups === 1 ? "pickup" : "pickups"}`} />
          <Figure
            label="Deposits held"
            value={t.deposits_cents > 0 ? formatMoney(t.deposits_cents, t.currency) : "none"}
            hint={t.deposits_cents > 0 ? "on your card, released when you collect" : "no listing in the plan asks one"}
          />
          <Figure label="Free" value={`${t.free_pickups} ${t.free_pickups === 1 ? "pickup" : "pickups"}`} hint="nothing to pay or hold" />
        </dl>
      ))}
      {costs.lines.length ? (
        <ul className="flex flex-col gap-1 text-sm">
          {costs.lines.map((l) => (
            <li key={l.listing_id} className="flex flex-wrap justify-between gap-x-3 border-b border-humus-100 py-1" data-cost-line={l.material}>
              <span>
                {formatListingQuantity(l.listing_quantity, l.listing_unit, system)} of {materialNoun(l.material)}
                {l.supplier ? <span className="text-humus-600"> · {l.supplier}</span> : null}
              </span>
              <span className="font-medium">
                {l.kind === "paid"
                  ? formatMoney(l.cost_cents, l.currency)
                  : l.kind === "deposit"
                    ? `free, ${formatMoney(l.deposit_cents, l.currency)} deposit held`
                    : "free"}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {costs.unmet.length ? (
        <p className="text-sm text-humus-700">
          Not found nearby: {costs.unmet.map((n) => `${formatQuantity(n.quantity, n.unit, system)} of ${materialNoun(n.material)}`).join(", ")}. Those are not in the sums.
        </p>
      ) : null}
      <p className="text-sm text-humus-600">{note ?? "From the nearest listings today; prices are the suppliers' own and can change until you reserve."}</p>
    </section>
  );
}

function Figure({ label, value, hint }: { label: string; value: string; hint: string }) {
  return (
    <div className="rounded-lg bg-white p-3 ring-1 ring-humus-200">
      <dt className="text-sm text-humus-600">{label}</dt>
      <dd className="text-lg font-semibold" data-cost={label}>
        {value}
      </dd>
      <dd className="text-xs text-humus-600">{hint}</dd>
    </div>
  );
}
