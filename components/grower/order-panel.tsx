"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { isApiError } from "@/lib/api/client";
import { dayLabel, STAGES_OF, stageLabel } from "@/lib/reservations/culture-orders";
import { formatLocal } from "@/lib/reservations/pickup-times";
import type { ReservationView } from "@/lib/reservations/view";
import { shipOrderSchema } from "@/lib/validation/grower";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { useReservationAction } from "@/components/reservations/use-reservation-action";
import { Form } from "@/components/ui/form";
import { CultureJourney } from "./culture-journey";

const LIVE = new Set(["held", "confirmed", "collected"]);
const isLink = (s: string) => /^https?:\/\/\S+$/i.test(s);

/**
 * A live-culture order on a reservation card or the grower's dashboard: where it goes, how
 * far the parcel has got, and the next step this person may take (the server's list).
 */
export function OrderPanel({ v }: { v: ReservationView }) {
  const { run, busy, error } = useReservationAction(v.id);
  const order = v.order;
  if (!order || !LIVE.has(v.status)) return null;
  return (
    <div className="flex flex-col gap-3 rounded-lg bg-humus-50 p-3 ring-1 ring-humus-200" data-testid="order-panel">
      <CultureJourney v={v} />
      {!order.stage ? <p className="text-sm text-humus-700">{v.side === "gardener" ? "The order starts once the grower accepts it." : "Accept it to start the order."}</p> : null}

      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
        <dt className="font-medium text-humus-600">{order.fulfilment === "post" ? "Posted to" : "Handed over"}</dt>
        <dd className="whitespace-pre-line break-words" data-testid="ship-to">
          {order.fulfilment === "post" ? order.ship_to : "Collected from the grower"}
        </dd>
        <dt className="font-medium text-humus-600">Roughly</dt>
        <dd>{order.estimated_count.toLocaleString("en-GB")} worms</dd>
        {order.carrier ? (
          <>
            <dt className="font-medium text-humus-600">Carrier</dt>
            <dd>
              {order.carrier}
              {order.shipped_at ? <span className="text-humus-600"> · posted {formatLocal(order.shipped_at)}</span> : null}
            </dd>
            <dt className="font-medium text-humus-600">Tracking</dt>
            <dd className="break-all" data-testid="tracking">
              {order.tracking && isLink(order.tracking) ? (
                <a href={order.tracking} className="text-moss-700 underline" rel="noopener noreferrer" target="_blank">
                  {order.tracking}
                </a>
              ) : (
                order.tracking
              )}
            </dd>
          </>
        ) : null}
      </dl>

      {v.side === "supplier" && order.posting && !order.posting.today && !order.posting.paused && (order.actions.includes("pack") || order.actions.includes("ship")) ? (
        <p className="rounded-lg bg-litter-100 p-2 text-sm ring-1 ring-litter-300" data-testid="posting-day-warning">
          Today is not one of your posting days: live worms packed or handed to the carrier now would wait in the parcel.
          {order.posting.next_day ? ` The next posting day is ${dayLabel(order.posting.next_day)}.` : ""}
        </p>
      ) : null}
      {order.actions.length ? (
        <div className="flex flex-wrap items-start gap-2">
          {order.actions.includes("pack") ? (
            <Button onClick={() => run("pack")} disabled={!!busy}>
              {busy === "pack" ? "Saving…" : "Mark packed"}
            </Button>
          ) : null}
          {order.actions.includes("deliver") ? (
            <Button variant={v.side === "gardener" ? "primary" : "secondary"} onClick={() => run("deliver")} disabled={!!busy}>
              {busy === "deliver" ? "Saving…" : v.side === "gardener" ? "It has arrived" : "Mark delivered"}
            </Button>
          ) : null}
        </div>
      ) : null}
      {order.actions.includes("ship") ? <ShipForm id={v.id} what={`${v.listing.title} for ${v.gardener.name}, ordered ${formatLocal(v.created_at)}`} /> : null}
      {error ? (
        <p role="alert" className="text-sm text-ember-600">
          {error.message}
        </p>
      ) : null}
    </div>
  );
}

// Named per order: a grower's page holds one of these forms for each order to post.
function ShipForm({ id, what }: { id: string; what: string }) {
  const { run, busy, error } = useReservationAction(id);
  const form = useForm<z.input<typeof shipOrderSchema>>({ resolver: zodResolver(shipOrderSchema), defaultValues: { carrier: "", tracking: "" } });
  const fields = error && isApiError(error) ? error.fields : undefined;
  const onSubmit = form.handleSubmit(async (values) => {
    await run("ship", values);
  });
  return (
    <Form onSubmit={onSubmit} noValidate className="grid gap-x-3 sm:grid-cols-2" aria-label={`Mark shipped: ${what}`}>
      <Field label="Carrier" id={`carrier-${id}`} autoComplete="off" {...form.register("carrier")} error={form.formState.errors.carrier?.message ?? fields?.carrier} />
      <Field label="Tracking number or link" id={`tracking-${id}`} autoComplete="off" {...form.register("tracking")} error={form.formState.errors.tracking?.message ?? fields?.tracking} />
      <Button type="submit" disabled={!!busy} className="self-start sm:col-span-2 sm:justify-self-start">
        {busy === "ship" ? "Saving…" : "Mark shipped"}
      </Button>
    </Form>
  );
}
