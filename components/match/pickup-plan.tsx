"use client";
import { formatMoney } from "@/lib/format/money";
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import type { Need } from "@/lib/match/types";
import { Notice } from "@/components/ui/notice";
import { useState } from "react";
import { ReserveAll, type StopProblems } from "./reserve-all";
import { PlanParcel, PlanStop, stopMoney, type PlanAllocation, type StopChoice } from "./plan-stop";
import { UnmetNeeds } from "./unmet-needs";
import type { PickupPlan as Plan, ReserveAllItem } from "./use-match";

function Totals({ plan, system }: { plan: Plan; system: UnitSystem }) {
  const t = plan.totals;
  const held = plan.costs.totals.reduce((sum, c) => sum + (c.currency === t.currency ? c.deposits_cents : 0), 0);
  const items = [
    ["Stops", t.parcels ? `${t.stops} + ${t.parcels} by post` : String(t.stops)],
    ["Driving", formatQuantity(plan.driving_distance_km, "km", system)],
    ["Trips", `${t.trips} ${t.trips === 1 ? "carload" : "carloads"}`],
    ["To pay suppliers", formatMoney(t.price_cents, t.currency, { zero: "free" })],
    ["Deposits held", held > 0 ? `${formatMoney(held, t.currency)}, back at pickup` : "none"],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5">
      {items.map(([k, v]) => (
        <div key={k} className="rounded-lg bg-white p-3 ring-1 ring-humus-200">
          <dt className="text-sm text-humus-600">{k}</dt>
          <dd className="text-lg font-semibold" data-total={k}>
            {v}
          </dd>
        </div>
      ))}
    </dl>
  );
}

export function PickupPlan({
  plan,
  system,
  bedId,
  onWiden,
  onSubstitute,
}: {
  plan: Plan;
  system: UnitSystem;
  bedId?: string;
  onWiden: (km: number) => void;
  onSubstitute: (need: Need, material: MaterialCode) => void;
}) {
  const byId = new Map(plan.allocations.map((a) => [a.listing_id, a]));
  const costOf = new Map(plan.costs.lines.map((l) => [l.listing_id, l]));
  const orderOf = new Map(plan.stops.map((s) => [s.listing_id, s.order]));
  const parcels = plan.allocations.filter((a) => a.fulfilment === "post");
  const [choices, setChoices] = useState<Record<string, StopChoice>>({});
  const [problems, setProblems] = useState<StopProblems>({});
  // A stop collects at its listing's first pickup time that leaves the supplier time to answer, unless changed.
  const choiceOf = (a: PlanAllocation): StopChoice => choices[a.listing_id] ?? { window: a.pickup_choices[0]?.id ?? "", ship_to: "" };
  const items: ReserveAllItem[] = [...plan.stops.map((s) => byId.get(s.listing_id)!), ...parcels].map((a) =>
    a.fulfilment === "post"
      ? { listing_id: a.listing_id, quantity: a.listing_quantity, fulfilment: "post", ship_to: choiceOf(a).ship_to.trim() || null }
      : { listing_id: a.listing_id, quantity: a.listing_quantity, pickup_window_id: choiceOf(a).window || null },
  );
  const names = Object.fromEntries(
    plan.allocations.map((a) => [a.listing_id, `${orderOf.has(a.listing_id) ? `Stop ${orderOf.get(a.listing_id)}` : "Parcel"}, ${a.title ?? MATERIALS[a.material].name}`]),
  );
  const lifting = plan.cautions.filter((c) => c.kind !== "material");
  const general = plan.cautions.filter((c) => c.kind === "material");
  return (
    <div className="flex flex-col gap-5">
      <Totals plan={plan} system={system} />
      <p className="text-sm text-humus-600">
        The loop through the stops is {formatQuantity(plan.total_distance_km, "km", system)}
        {plan.trips.length > 1 ? `; carrying it all takes ${plan.trips.length} trips from the start, ${formatQuantity(plan.driving_distance_km, "km", system)} in all` : ""}.
        Driving counted at {formatMoney(plan.totals.travel_cents, plan.totals.currency)}, stops at {formatMoney(plan.totals.stop_cents, plan.totals.currency)}.
      </p>

      <UnmetNeeds unmet={plan.unmet} radiusKm={plan.radius_km} system={system} onWiden={onWiden} onSubstitute={onSubstitute} bedId={bedId} />

      {plan.stops.length ? (
        <section aria-labelledby="stops-title">
          <h3 id="stops-title" className="mb-2 text-lg font-semibold">
            Pickups in order
          </h3>
          <ol className="flex flex-col gap-2">
            {plan.stops.map((s) => {
              const a = byId.get(s.listing_id)!;
              return (
                <PlanStop
                  key={s.listing_id}
                  a={a}
                  order={s.order}
                  system={system}
                  money={stopMoney(a, costOf.get(s.listing_id)?.deposit_cents)}
                  choice={choiceOf(a)}
                  onChoice={(c) => setChoices({ ...choices, [a.listing_id]: c })}
                  problems={problems[a.listing_id]}
                />
              );
            })}
          </ol>
        </section>
      ) : null}

      {parcels.length ? (
        <section aria-labelledby="parcels-title">
          <h3 id="parcels-title" className="mb-2 text-lg font-semibold">
            By post
          </h3>
          <ul className="flex flex-col gap-2">
            {parcels.map((a) => (
              <PlanParcel
                key={a.listing_id}
                a={a}
                system={system}
                money={stopMoney(a, costOf.get(a.listing_id)?.deposit_cents)}
                choice={choiceOf(a)}
                onChoice={(c) => setChoices({ ...choices, [a.listing_id]: c })}
                problems={problems[a.listing_id]}
              />
            ))}
          </ul>
        </section>
      ) : null}

      {plan.trips.length > 1 ? (
        <section aria-labelledby="trips-title">
          <h3 id="trips-title" className="mb-2 text-lg font-semibold">
            Carloads
          </h3>
          <ul className="flex flex-col gap-1 text-sm">
            {plan.trips.map((t, i) => (
              <li key={i}>
                Trip {i + 1}: stop{t.stops.length > 1 ? "s" : ""} {t.stops.map((id) => orderOf.get(id)).join(", ")} — {formatQuantity(t.load_l, "l", system)},{" "}
                {formatQuantity(t.load_kg, "kg", system)}, {formatQuantity(t.distance_km, "km", system)}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {lifting.map((c) => (
        <Notice key={c.message} tone="caution" title={c.kind === "lifting" ? "Heavy lifting" : "Too big for the car"}>
          {c.message}
          {c.listing_ids?.length ? ` (stop ${c.listing_ids.map((id) => orderOf.get(id)).join(", ")})` : ""}
        </Notice>
      ))}
      {general.length ? (
        <Notice tone="caution" title="Before you collect">
          <ul className="list-disc pl-5">
            {general.map((c) => (
              <li key={c.message}>{c.message}</li>
            ))}
          </ul>
        </Notice>
      ) : null}

      {plan.allocations.length ? <ReserveAll items={items} bedId={bedId} names={names} problems={problems} onProblems={setProblems} /> : null}
    </div>
  );
}
