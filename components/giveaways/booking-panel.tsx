"use client";
import { formatMoney } from "@/lib/format/money";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import Link from "next/link";
import { bookingSchema, giveawayQuantityIssue } from "@/lib/validation/giveaways";
import type { SlotView } from "@/lib/giveaways/view";
import type { VisitorBooking } from "@/lib/services/giveaways/get-giveaway-for-visitor";
import { formatGiveawayQuantity, formatTypedGiveawayQuantity } from "@/lib/format/giveaway";
import { useUnits } from "@/components/ui/units-context";
import { depositLabel } from "@/lib/format/giveaway-deposit";
import { readableDateTime, wallTime } from "@/lib/time/zoned";
import { isApiError, submitOnce } from "@/lib/api/client";
import { useSubmitKeys } from "@/components/ui/use-submit-keys";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { buttonClass } from "@/components/ui/button-class";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";

type Values = z.infer<typeof bookingSchema>;

export interface BookingPanelProps {
  dayId: string;
  timeZone: string;
  unit: "bags" | "m3";
  householdCap: number;
  depositCents: number;
  currency: string;
  slots: SlotView[];
  window: "open" | "not_yet" | "closed" | "cancelled";
  windowLabel: string;
  signedIn: boolean;
  booking: VisitorBooking | null;
  /** The server's "now" when the page was made (ISO), so the render stays pure. */
  now: string;
}

export function BookingPanel(p: BookingPanelProps) {
  if (p.booking) return <MyBooking {...p} booking={p.booking} />;
  if (p.window !== "open") return <Notice tone={p.window === "cancelled" ? "error" : "info"}>{p.windowLabel}.</Notice>;
  if (!p.signedIn) {
    return (
      <div className="flex flex-col gap-2 rounded-lg bg-white p-4 ring-1 ring-humus-200">
        <p>Sign in to book a slot for your household. New here? Joining takes a minute.</p>
        <div className="flex flex-wrap gap-2">
          <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/giveaways/${p.dayId}`)}`} className={buttonClass("primary")}>
            Sign in to book
          </Link>
          <Link href="/sign-up" className={buttonClass("secondary")}>
            Join
          </Link>
        </div>
      </div>
    );
  }
  return <BookForm {...p} />;
}

function BookForm(p: BookingPanelProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const keys = useSubmitKeys();
  const firstOpen = p.slots.find((s) => s.remaining > 0);
  const form = useForm<Values>({ resolver: zodResolver(bookingSchema), defaultValues: { slot_id: firstOpen?.id ?? "", quantity: Math.min(p.householdCap, p.unit === "bags" ? 2 : 0.5) } });
  const { system } = useUnits();
  const unitWord = p.unit === "bags" ? "bags" : "m³";
  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    const wholeIssue = giveawayQuantityIssue(values.quantity, p.unit);
    if (wholeIssue) {
      form.setError("quantity", { message: wholeIssue });
      return;
    }
    if (values.quantity > p.householdCap) {
      form.setError("quantity", { message: `At most ${formatTypedGiveawayQuantity(p.householdCap, p.unit, system)} a household.` });
      return;
    }
    try {
      const res = await submitOnce<{ checkout_url?: string }>(keys, `/api/giveaways/${p.dayId}/bookings`, { body: values });
      // A deposit day: the place is held, and the card page puts the deposit on hold.
      if (res.checkout_url) window.location.assign(res.checkout_url);
      else router.refresh();
    } catch (err) {
      if (isApiError(err) && err.fields) for (const [k, m] of Object.entries(err.fields)) form.setError(k as keyof Values, { message: m });
      setError(isApiError(err) ? err.message : "The booking did not go through. Please try again.");
    }
  });
  const slotError = form.formState.errors.slot_id?.message;
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200" aria-labelledby="book-title">
      <h2 id="book-title" className="text-lg font-semibold">
        Book a slot
      </h2>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <fieldset className="flex flex-col gap-2" aria-describedby={slotError ? "slot-error" : undefined}>
        <legend className="font-medium">Arrival time</legend>
        {p.slots.map((s) => (
          <label key={s.id} className={`flex min-h-11 items-center gap-3 rounded-lg px-3 ring-1 ${s.remaining ? "ring-humus-300" : "text-humus-500 ring-humus-200"}`}>
            <input type="radio" value={s.id} disabled={!s.remaining} {...form.register("slot_id")} className="h-5 w-5" />
            <span className="font-medium">
              {wallTime(s.starts_at, p.timeZone)}–{wallTime(s.ends_at, p.timeZone)}
            </span>
            <span className="text-sm">{s.remaining ? `${s.remaining} of ${s.capacity} places left` : "full"}</span>
          </label>
        ))}
        <p id="slot-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
          {slotError ?? ""}
        </p>
      </fieldset>
      <Field
        label={`How much (${unitWord})`}
        type="number"
        step={p.unit === "bags" ? 1 : 0.01}
        min={0}
        inputMode="decimal"
        hint={`Up to ${formatTypedGiveawayQuantity(p.householdCap, p.unit, system)} a household.`}
        {...form.register("quantity", { valueAsNumber: true })}
        error={form.formState.errors.quantity?.message}
      />
      {p.depositCents > 0 ? (
        <p className="text-sm text-humus-700">
          This day asks a refundable {formatMoney(p.depositCents, p.currency)} no-show deposit. After you book, a card page puts it on hold (not a charge), and your place
          is held meanwhile. It is released when you are checked in, when you cancel in time, or if the day is called off, and taken only if you do not come.
        </p>
      ) : null}
      <p className="text-sm text-humus-600">One booking per household (one Duffbank account) for this day.</p>
      <Button type="submit" disabled={form.formState.isSubmitting || !firstOpen}>
        {form.formState.isSubmitting ? "Booking…" : firstOpen ? "Book this slot" : "Every slot is full"}
      </Button>
    </Form>
  );
}

function MyBooking(p: BookingPanelProps & { booking: VisitorBooking }) {
  const action = useApiAction();
  const b = p.booking;
  const { system } = useUnits();
  const canCancel = b.status === "booked" && Date.parse(p.now) < Date.parse(b.cancel_until);
  const awaiting = b.status === "booked" && b.deposit_status === "awaiting";
  return (
    <section aria-labelledby="booked-title" className="flex flex-col gap-3 rounded-lg bg-moss-50 p-4 ring-1 ring-moss-300">
      <h2 id="booked-title" className="text-lg font-semibold">
        {b.status === "checked_in" ? "Collected — thank you" : awaiting ? "Your place is held: put the deposit down to confirm it" : "You're booked"}
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="font-medium">Arrive</dt>
        <dd>
          {wallTime(b.starts_at, p.timeZone)}–{wallTime(b.ends_at, p.timeZone)}
        </dd>
        <dt className="font-medium">Taking</dt>
        <dd>{formatGiveawayQuantity(b.quantity, p.unit, system)}</dd>
        <dt className="font-medium">Where</dt>
        <dd>{b.address}</dd>
        {b.deposit_cents > 0 ? (
          <>
            <dt className="font-medium">Deposit</dt>
            <dd>{depositLabel(b.deposit_cents, p.currency, b.deposit_status)}</dd>
          </>
        ) : null}
      </dl>
      {awaiting ? (
        <Notice tone="info">
          {b.hold_expires_at ? `Put the deposit on hold by ${readableDateTime(b.hold_expires_at, p.timeZone)}, or the place goes back to other households. ` : ""}
          If you have just done so, this page shows it within a minute or two.{" "}
          {b.checkout_url ? (
            <a href={b.checkout_url} className="font-medium underline">
              Put down the deposit
            </a>
          ) : (
            "The card page could not be opened just now. Your place stays held: reload in a minute to try again, and we e-mail you as soon as it opens."
          )}
        </Notice>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <a href={`/api/giveaways/${p.dayId}/bookings/${b.id}/calendar.ics`} className={buttonClass("secondary")}>
          Add to calendar (.ics)
        </a>
        {canCancel ? (
          <Button variant="danger" disabled={action.busy} onClick={() => action.run(`/api/giveaways/${p.dayId}/bookings/${b.id}`, { method: "DELETE", idempotent: true })}>
            {action.busy ? "Cancelling…" : "Cancel my booking"}
          </Button>
        ) : null}
      </div>
      <p className="text-sm text-humus-700">
        {canCancel
          ? `You can cancel until ${readableDateTime(b.cancel_until, p.timeZone)}; that frees the place for someone else.`
          : b.status === "booked"
            ? "It is too late to cancel on Duffbank; if you cannot come, tell the council."
            : null}
      </p>
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
    </section>
  );
}
