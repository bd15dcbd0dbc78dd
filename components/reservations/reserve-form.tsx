"use client";
import { formatMoney } from "@/lib/format/money";
import { useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import type { z } from "zod";
import { reserveOneSchema } from "@/lib/validation/reservations";
import { isApiError, submitOnce } from "@/lib/api/client";
import { useSubmitKeys } from "@/components/ui/use-submit-keys";
import { listingPrice } from "@/lib/payments/money";
import { formatListingQuantity } from "@/lib/listings/format";
import { formatListingPrice, packCount, packQuantity, packsIn, wholePacks } from "@/lib/listings/packs";
import { quantityLimitProblem, typedQuantityLabel } from "@/lib/reservations/labels";
import { equivalentOf } from "@/lib/reservations/equivalents";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { CANCEL_NOTICE_HOURS } from "@/lib/reservations/policy";
import { type UnitSystem, WHOLE_UNITS } from "@/lib/calc/units";
import type { ReserveOffer } from "@/lib/services/reservations/load-reserve-offer";
import { Field, TextAreaField } from "@/components/ui/field";
import { dayLabel } from "@/lib/reservations/culture-orders";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Form } from "@/components/ui/form";

type Values = z.input<typeof reserveOneSchema>;
type Answer = { reservation: { id: string; status: string }; checkout_url?: string };

const UNIT_QUESTION: Record<string, string> = { bales: "How many bales", bags: "How many bags", sheets: "How many sheets", kg: "How many kilograms", m3: "How many cubic metres", m2: "How many square metres" };

/**
 * How long the hold lasts and who moves next, with the deadline the supplier would have to
 * answer by for the chosen pickup (lib/reservations/policy.ts, worked out on the server).
 */
function holdSentence(offer: ReserveOffer, windowId: string | null, posted: boolean): string {
  const name = offer.supplier.name;
  const answerBy = windowId ? offer.windows.find((w) => w.id === windowId)?.answer_by : offer.answer_by_no_window;
  const after = posted ? "then you are e-mailed when it is packed and posted, with the tracking." : "then you get the address and your pickup code by e-mail.";
  if (offer.waits_for === "checkout") {
    const answer = offer.auto_accept
      ? `This listing accepts at once: ${posted ? "you are e-mailed when it is packed and when it is posted, with the tracking." : "you get the address and your pickup code by e-mail."}`
      : `Once you have paid, ${name} has until ${answerBy ? formatLocal(answerBy) : "the pickup"} at the latest to accept (always before your pickup starts); ${after}`;
    return `We hold it for ${offer.hold_minutes} minutes while you pay. ${answer}`;
  }
  if (offer.waits_for === "answer") {
    return `We hold it for you while ${name} decides: they have until ${answerBy ? formatLocal(answerBy) : "the pickup"} to accept (always before your pickup starts), and are reminded half-way. When they accept, ${after.replace(/^then /, "")}`;
  }
  return "This listing accepts at once, and you get the address and your pickup code by e-mail.";
}

/** `cautions` are for collecting; `postedCautions`, where given, replace them while posting is chosen. */
export function ReserveForm({ offer, unitSystem, cautions, postedCautions }: { offer: ReserveOffer; unitSystem: UnitSystem; cautions: string[]; postedCautions?: string[] }) {
  const router = useRouter();
  const culture = offer.culture;
  const [error, setError] = useState<string | null>(null);
  const keys = useSubmitKeys();
  const whole = WHOLE_UNITS.has(offer.unit);
  // Sold by the pack: the buyer counts packs; the quantity sent is those packs' weight.
  const pack = offer.pack;
  const packsLeft = pack ? wholePacks(offer.max_per_reservation !== null ? Math.min(offer.max_per_reservation, offer.available) : offer.available, pack) : 0;
  const [packs, setPacks] = useState("1");
  /** Why the packs asked for (as the quantity they weigh) cannot be reserved, or null. */
  const packProblem = (quantity: number): string | null => {
    if (!pack) return null;
    const n = Number.isFinite(quantity) ? packsIn(quantity, pack) : null;
    if (n === null) return "Give a whole number of packs, 1 or more.";
    if (n > packsLeft) return packsLeft > 0 ? `At most ${packCount(packsLeft)} on this listing.` : "Nothing is left.";
    return null;
  };
  // The packs are checked with the rest of the form, so a count that is mended clears its
  // message as the field is typed in after a submit, as the other quantity fields do.
  const schemaResolver = zodResolver(reserveOneSchema) as unknown as Resolver<Values>;
  const resolver: Resolver<Values> = async (values, context, options) => {
    const result = await schemaResolver(values, context, options);
    const problem = packProblem(Number(values.quantity));
    return problem ? { values: {}, errors: { ...result.errors, quantity: { type: "packs", message: problem } } } : result;
  };
  const form = useForm<Values>({
    resolver,
    defaultValues: {
      listing_id: offer.id,
      quantity: pack ? pack.size : 1,
      pickup_window_id: offer.windows[0]?.id ?? null,
      bed_id: null,
      // A live culture is collected where the grower offers it, posted otherwise.
      fulfilment: culture ? (culture.pickup ? "pickup" : "post") : null,
      ship_to: "",
    },
  });
  const posted = useWatch({ control: form.control, name: "fulfilment" }) === "post";
  const quantity = Number(useWatch({ control: form.control, name: "quantity" }));
  const price = listingPrice(offer, Number.isFinite(quantity) ? quantity : 0);
  const equivalent = equivalentOf(offer, quantity, unitSystem);
  const limit = offer.max_per_reservation !== null ? Math.min(offer.max_per_reservation, offer.available) : offer.available;
  const chosenWindow = useWatch({ control: form.control, name: "pickup_window_id" }) ?? null;

  const choosePacks = (text: string) => {
    setPacks(text);
    const n = Number(text);
    const weight = pack && text.trim() !== "" && Number.isFinite(n) ? packQuantity(n, pack) : NaN;
    form.setValue("quantity", weight, { shouldValidate: form.formState.isSubmitted });
  };

  const onSubmit = form.handleSubmit(
    async (values) => {
      setError(null);
      let answer: Answer;
      try {
        // A parcel has no pickup window; a collected culture has no postal address.
        const body = values.fulfilment === "post" ? { ...values, pickup_window_id: null } : { ...values, ship_to: null };
        answer = await submitOnce<Answer>(keys, "/api/reservations", { body });
      } catch (err) {
        if (isApiError(err) && err.fields) for (const [name, message] of Object.entries(err.fields)) form.setError(name as keyof Values, { message });
        setError(isApiError(err) ? err.message : "We could not reserve it. Please try again.");
        return;
      }
      if (answer.checkout_url) window.location.assign(answer.checkout_url);
      else router.push(`/reservations/${answer.reservation.id}?new=1`);
    },
    // The packs field is not one of the form's registered fields: give it the focus by its name.
    (errors, event) => {
      if (pack && errors.quantity) (event?.target as HTMLFormElement | undefined)?.querySelector<HTMLInputElement>('input[name="quantity"]')?.focus();
    },
  );

  const submitLabel = offer.price_cents > 0 ? `Reserve and pay ${formatMoney(price, offer.currency)}` : offer.deposit_cents > 0 ? `Reserve and place the ${formatMoney(offer.deposit_cents, offer.currency)} deposit` : "Reserve";
  const busy = form.formState.isSubmitting;
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <div>
        {pack ? (
          <Field
            label="How many packs"
            name="quantity"
            type="number"
            inputMode="numeric"
            min={1}
            step={1}
            max={packsLeft}
            value={packs}
            onChange={(e) => choosePacks(e.target.value)}
            hint={`${packCount(wholePacks(offer.available, pack))} left${offer.max_per_reservation !== null && offer.max_per_reservation < offer.available ? ` · at most ${packCount(packsLeft)} per reservation` : ""} · each pack is ${formatListingQuantity(pack.size, offer.unit, unitSystem)}`}
            error={form.formState.errors.quantity?.message}
            className="max-w-40"
          />
        ) : (
          <Field
            label={UNIT_QUESTION[offer.unit] ?? "How much"}
            type="number"
            inputMode={whole ? "numeric" : "decimal"}
            min={whole ? 1 : 0.01}
            step={whole ? 1 : 0.01}
            max={limit}
            hint={`${typedQuantityLabel(offer.available, offer.unit, unitSystem)} left${offer.max_per_reservation !== null && offer.max_per_reservation < offer.available ? ` · at most ${typedQuantityLabel(offer.max_per_reservation, offer.unit, unitSystem)} per reservation` : ""}`}
            {...form.register("quantity", {
              valueAsNumber: true,
              validate: (q) => (Number.isFinite(q) ? (quantityLimitProblem(q, offer, unitSystem) ?? true) : true),
            })}
            error={form.formState.errors.quantity?.message}
            className="max-w-40"
          />
        )}
        {/* Only for whole packs: part of a pack is refused, so its weight would mislead. */}
        {pack && Number.isFinite(quantity) && packsIn(quantity, pack) !== null ? (
          <p className="text-sm text-humus-700" aria-live="polite">
            That is {formatListingQuantity(quantity, offer.unit, unitSystem)} of worms in all.
          </p>
        ) : null}
        {equivalent ? (
          <p className="text-sm text-humus-700" aria-live="polite">
            That is {equivalent}.
          </p>
        ) : null}
      </div>

      {culture ? (
        <fieldset className="flex flex-col gap-2" aria-describedby="fulfilment-error">
          <legend className="mb-1 font-medium">How the worms reach you</legend>
          {culture.pickup ? (
            <label className="flex items-start gap-3 rounded-lg p-2 ring-1 ring-humus-200">
              <input type="radio" value="pickup" {...form.register("fulfilment")} className="mt-1 h-5 w-5 shrink-0" />
              <span>
                <span className="font-medium">Collect them</span>
                <span className="block text-sm text-humus-600">From {offer.supplier.name}, at a time below; the address comes when they accept.</span>
              </span>
            </label>
          ) : null}
          {culture.ships ? (
            <label className={`flex items-start gap-3 rounded-lg p-2 ring-1 ring-humus-200 ${culture.can_post ? "" : "opacity-70"}`}>
              <input type="radio" value="post" disabled={!culture.can_post} {...form.register("fulfilment")} className="mt-1 h-5 w-5 shrink-0" />
              <span>
                <span className="font-medium">Post them to me</span>
                <span className="block text-sm text-humus-600">
                  {culture.can_post
                    ? `${culture.shipping.notice}${culture.next_posting_day ? ` Ordered now, it goes out on ${dayLabel(culture.next_posting_day)} at the earliest.` : ""}`
                    : culture.shipping.notice}
                </span>
              </span>
            </label>
          ) : null}
          <p id="fulfilment-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
            {form.formState.errors.fulfilment?.message ?? ""}
          </p>
          {posted ? (
            <TextAreaField
              label="Postal address"
              rows={3}
              autoComplete="shipping street-address"
              hint={`Only you and ${offer.supplier.name} see it.`}
              {...form.register("ship_to")}
              error={form.formState.errors.ship_to?.message}
            />
          ) : null}
        </fieldset>
      ) : null}

      {posted ? null : (
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 font-medium">When you will collect</legend>
          {offer.windows.map((w) => (
            <label key={w.id} className="flex items-start gap-3 rounded-lg p-2 ring-1 ring-humus-200">
              <input type="radio" value={w.id} {...form.register("pickup_window_id", { setValueAs: (v) => v || null })} className="mt-1 h-5 w-5 shrink-0" />
              <span>
                <span className="font-medium">{w.label}</span>
                <span className="block text-sm text-humus-600">
                  Yours: {formatLocal(w.next_start)}
                  {w.answer_by ? ` · ${offer.supplier.name} answers by ${formatLocal(w.answer_by)}` : ""}
                </span>
              </span>
            </label>
          ))}
          <label className="flex items-start gap-3 rounded-lg p-2 ring-1 ring-humus-200">
            <input type="radio" value="" {...form.register("pickup_window_id", { setValueAs: (v) => v || null })} className="mt-1 h-5 w-5 shrink-0" />
            <span>
              <span className="font-medium">No fixed time</span>
              <span className="block text-sm text-humus-600">Agree a time with {offer.supplier.name} in the messages, within a week.</span>
            </span>
          </label>
          <p aria-live="polite" className="min-h-5 text-sm text-ember-600">
            {form.formState.errors.pickup_window_id?.message ?? ""}
          </p>
        </fieldset>
      )}

      <section aria-labelledby="cost-title" className="rounded-lg bg-moss-50 p-4 ring-1 ring-moss-200">
        <h2 id="cost-title" className="font-semibold">
          {offer.price_cents > 0 ? `${formatMoney(price, offer.currency)} in all` : offer.deposit_cents > 0 ? `Free, with a ${formatMoney(offer.deposit_cents, offer.currency)} no-show deposit` : "Free"}
        </h2>
        <ul className="mt-2 list-disc pl-5 text-sm leading-relaxed text-humus-800">
          {offer.price_cents > 0 ? (
            <li>
              {formatListingPrice(offer, unitSystem)}, paid by card on the next page. Refunded in full if {offer.supplier.name} declines or cancels, or if you cancel {posted ? "before it is packed" : `at least ${CANCEL_NOTICE_HOURS} hours before your pickup`}.
            </li>
          ) : offer.deposit_cents > 0 ? (
            <li>
              The deposit is held on your card, not taken: it is released when you collect or cancel at least {CANCEL_NOTICE_HOURS} hours ahead, and kept only if you do not come.
            </li>
          ) : (
            <li>Nothing to pay. Please cancel if your plans change, so someone else can have it.</li>
          )}
          <li>{holdSentence(offer, posted ? null : chosenWindow, posted)}</li>
          {culture ? <li>A care sheet for the worms (bedding, temperature, feeding, when to add them to a bed) comes by e-mail when you order.</li> : null}
        </ul>
      </section>

      <Notice tone="caution" title={culture ? "Live animals" : "Before you collect"}>
        <ul className="list-disc pl-5">
          {(posted && postedCautions ? postedCautions : cautions).map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </Notice>

      <Button type="submit" disabled={busy} className="self-start">
        {busy ? "Reserving…" : submitLabel}
      </Button>
    </Form>
  );
}
