"use client";
import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import { MATERIALS } from "@/lib/calc/facts";
import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun } from "@/lib/match/format";
import { formatListingQuantity } from "@/lib/listings/format";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { packCount } from "@/lib/listings/packs";
import type { PickupPlan as Plan } from "./use-match";

export type PlanAllocation = Plan["allocations"][number];

/** What the gardener chose for a stop before reserving: a pickup time, or a parcel's address. */
export interface StopChoice {
  window: string;
  ship_to: string;
}

/** "Take 3 bales of straw (0.5 m³ of straw)", or "Order 2 packs, 1 kg of worms". */
function Take({ a, system }: { a: PlanAllocation; system: UnitSystem }) {
  return (
    <p>
      {a.fulfilment === "post" ? "Order" : "Take"} <strong>{a.packs ? `${packCount(a.packs)}, ${formatListingQuantity(a.listing_quantity, a.listing_unit, system)}` : formatListingQuantity(a.listing_quantity, a.listing_unit, system)}</strong>
      {a.listing_unit === a.unit ? ` of ${materialNoun(a.material)}` : ` (${formatQuantity(a.quantity, a.unit, system)} of ${materialNoun(a.material)})`}
    </p>
  );
}

function Problems({ id, messages }: { id: string; messages: string[] | undefined }) {
  return (
    <p id={id} aria-live="polite" className="text-sm font-medium text-ember-800 empty:hidden">
      {messages?.join(" ") ?? ""}
    </p>
  );
}

const selectClass = "min-h-11 w-full max-w-md rounded-lg border bg-white px-2 py-2";

/** One stop on the route: its listing, what to take, when to collect, and any problem reserving it. */
export function PlanStop({
  a,
  order,
  system,
  money,
  choice,
  onChoice,
  problems,
}: {
  a: PlanAllocation;
  order: number;
  system: UnitSystem;
  /** "€9.00 · €2.00 deposit held, back at pickup" */
  money: string;
  choice: StopChoice;
  onChoice: (c: StopChoice) => void;
  problems: string[] | undefined;
}) {
  const selectId = `stop-${a.listing_id}`;
  const chosen = a.pickup_choices.find((w) => w.id === choice.window);
  const answerBy = chosen ? chosen.answer_by : a.answer_by_no_window;
  return (
    <li className={`flex gap-3 rounded-lg bg-white p-3 ring-1 ${problems?.length ? "ring-2 ring-ember-600" : "ring-humus-200"}`} data-stop={order}>
      <span className="flex h-9 w-9 shrink-0 items-center justify-center rounded-full bg-moss-600 font-bold text-white" aria-label={`Stop ${order}`}>
        {order}
      </span>
      <div className="flex min-w-0 flex-1 flex-col gap-1">
        <p className="font-semibold">
          <Link href={`/listings/${a.listing_id}`} className="underline decoration-moss-300 underline-offset-4 hover:text-moss-800">
            {a.title ?? MATERIALS[a.material].name}
          </Link>
        </p>
        <p className="text-sm text-humus-700">
          {a.supplier ? `${a.supplier} · ` : ""}
          {formatQuantity(a.distance_km, "km", system)} from the start
        </p>
        <Take a={a} system={system} />
        <p className="text-sm text-humus-700">
          {money} · about {formatQuantity(a.load_kg, "kg", system)}, {formatQuantity(a.load_l, "l", system)}
        </p>
        <label htmlFor={selectId} className="mt-1 text-sm font-medium">
          When you collect
        </label>
        <select
          id={selectId}
          value={choice.window}
          onChange={(e) => onChoice({ ...choice, window: e.target.value })}
          aria-invalid={problems?.length ? true : undefined}
          aria-describedby={`${selectId}-answer ${selectId}-error`}
          className={`${selectClass} ${problems?.length ? "border-ember-600" : "border-humus-300"}`}
        >
          {a.pickup_choices.map((w) => (
            <option key={w.id} value={w.id}>
              {w.label} (yours: {formatLocal(w.next_start)})
            </option>
          ))}
          <option value="">No fixed time: agree one in the messages, within a week</option>
        </select>
        <p id={`${selectId}-answer`} className="text-sm text-humus-600">
          {answerBy ? `${a.supplier ?? "The supplier"} answers by ${formatLocal(answerBy)}.` : "Accepts at once."}
        </p>
        <Problems id={`${selectId}-error`} messages={problems} />
      </div>
    </li>
  );
}

/** A live culture that comes by post: no stop on the route, an address to send it to. */
export function PlanParcel({ a, system, money, choice, onChoice, problems }: { a: PlanAllocation; system: UnitSystem; money: string; choice: StopChoice; onChoice: (c: StopChoice) => void; problems: string[] | undefined }) {
  const fieldId = `stop-${a.listing_id}`;
  return (
    <li className={`flex flex-col gap-1 rounded-lg bg-white p-3 ring-1 ${problems?.length ? "ring-2 ring-ember-600" : "ring-humus-200"}`} data-parcel>
      <p className="font-semibold">
        <Link href={`/listings/${a.listing_id}`} className="underline decoration-moss-300 underline-offset-4 hover:text-moss-800">
          {a.title ?? MATERIALS[a.material].name}
        </Link>
      </p>
      <p className="text-sm text-humus-700">{a.supplier ? `Posted by ${a.supplier}` : "Posted"}: not a stop on your route.</p>
      <Take a={a} system={system} />
      <p className="text-sm text-humus-700">{money}</p>
      <label htmlFor={fieldId} className="mt-1 text-sm font-medium">
        Postal address for the parcel
      </label>
      <textarea
        id={fieldId}
        rows={3}
        autoComplete="shipping street-address"
        value={choice.ship_to}
        onChange={(e) => onChoice({ ...choice, ship_to: e.target.value })}
        aria-invalid={problems?.length ? true : undefined}
        aria-describedby={`${fieldId}-hint ${fieldId}-error`}
        className={`min-h-11 w-full max-w-md rounded-lg border bg-white px-3 py-2 ${problems?.length ? "border-ember-600" : "border-humus-300"}`}
      />
      <p id={`${fieldId}-hint`} className="text-sm text-humus-600">
        Only you and {a.supplier ?? "the grower"} see it.
      </p>
      <Problems id={`${fieldId}-error`} messages={problems} />
    </li>
  );
}

/** The money line of a stop: its price and any deposit held. */
export function stopMoney(a: PlanAllocation, depositCents: number | undefined): string {
  return `${formatMoney(a.cost_cents, a.currency, { zero: "free" })}${depositCents ? ` · ${formatMoney(depositCents, a.currency)} deposit held, back at pickup` : ""}`;
}
