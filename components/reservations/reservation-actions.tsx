"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { cancelSchema, collectSchema } from "@/lib/validation/reservations";
import { isApiError } from "@/lib/api/client";
import type { ReservationAction, Side } from "@/lib/reservations/policy";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { useReservationAction } from "./use-reservation-action";
import { Form } from "@/components/ui/form";

interface Props {
  id: string;
  side: Side;
  actions: ReservationAction[];
  canPay: boolean;
  /** The payment page could not be opened before: the pay button is a "try again". */
  payAgain?: boolean;
  cancelNote: string;
  /** A live culture sent by post: an order rather than something collected, and worded so. */
  posted?: boolean;
}

/** The buttons for what this person may do next; the server decides, this only shows its list. */
export function ReservationActions({ id, side, actions, canPay, payAgain = false, cancelNote, posted = false }: Props) {
  const { run, busy, error } = useReservationAction(id);
  const [open, setOpen] = useState<"decline" | "cancel" | "no_show" | null>(null);
  if (!canPay && actions.length === 0) return null;
  const pay = async () => {
    const out = await run<{ checkout_url: string }>("checkout");
    if (out?.checkout_url) window.location.assign(out.checkout_url);
  };
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-2">
        {canPay ? (
          <Button onClick={pay} disabled={!!busy}>
            {busy === "checkout" ? "Opening the payment page…" : payAgain ? "Try the payment again" : "Pay now"}
          </Button>
        ) : null}
        {actions.includes("confirm") ? (
          <Button onClick={() => run("confirm")} disabled={!!busy}>
            {busy === "confirm" ? "Accepting…" : "Accept"}
          </Button>
        ) : null}
        {actions.includes("decline") ? (
          <Button variant="secondary" onClick={() => setOpen(open === "decline" ? null : "decline")} aria-expanded={open === "decline"} disabled={!!busy}>
            Decline
          </Button>
        ) : null}
        {actions.includes("no_show") ? (
          <Button variant="secondary" onClick={() => setOpen(open === "no_show" ? null : "no_show")} aria-expanded={open === "no_show"} disabled={!!busy}>
            They did not come
          </Button>
        ) : null}
        {/* A supplier turns down a held request with Decline; Cancel is for after accepting. */}
        {actions.includes("cancel") && !(side === "supplier" && actions.includes("decline")) ? (
          <Button variant="secondary" onClick={() => setOpen(open === "cancel" ? null : "cancel")} aria-expanded={open === "cancel"} disabled={!!busy}>
            {posted ? "Cancel order" : "Cancel reservation"}
          </Button>
        ) : null}
      </div>
      {actions.includes("collect") ? <CollectForm id={id} /> : null}
      {open === "decline" ? <ReasonForm id={id} action="decline" label="Decline the request" note="Any payment or deposit goes back to the gardener in full." /> : null}
      {open === "cancel" ? <ReasonForm id={id} action="cancel" label="Yes, cancel it" note={cancelNote} /> : null}
      {open === "no_show" ? <ReasonForm id={id} action="no-show" label="Record a no-show" note="The quantity goes back on your listing; a deposit is kept." /> : null}
      {error ? (
        <p role="alert" className="text-sm text-ember-600">
          {error.message}
        </p>
      ) : null}
      {side === "gardener" && canPay && !payAgain ? <p className="text-sm text-humus-600">The reservation moves on as soon as Stripe tells us the payment is through.</p> : null}
    </div>
  );
}

function ReasonForm({ id, action, label, note }: { id: string; action: "decline" | "cancel" | "no-show"; label: string; note: string }) {
  const { run, busy } = useReservationAction(id);
  const form = useForm<z.input<typeof cancelSchema>>({ resolver: zodResolver(cancelSchema), defaultValues: { reason: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    await run(action, values.reason ? values : {});
  });
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-1 rounded-lg bg-humus-50 p-3 ring-1 ring-humus-200">
      <p className="text-sm text-humus-700">{note}</p>
      <Field label="A note for the other side (optional)" id={`${action}-${id}`} {...form.register("reason")} error={form.formState.errors.reason?.message} />
      <Button type="submit" variant={action === "decline" ? "secondary" : "danger"} disabled={!!busy} className="self-start">
        {busy ? "Saving…" : label}
      </Button>
    </Form>
  );
}

function CollectForm({ id }: { id: string }) {
  const { run, busy, error } = useReservationAction(id);
  const form = useForm<z.input<typeof collectSchema>>({ resolver: zodResolver(collectSchema), defaultValues: { pickup_code: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    if (!values.pickup_code?.trim()) {
      form.setError("pickup_code", { message: "Type the gardener's code, or use “Collected without a code”." });
      return;
    }
    await run("collect", values);
  });
  const fieldError = form.formState.errors.pickup_code?.message ?? (error && isApiError(error) ? error.fields?.pickup_code : undefined);
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-1 rounded-lg bg-moss-50 p-3 ring-1 ring-moss-200">
      <Field label="Pickup code" id={`code-${id}`} autoComplete="off" autoCapitalize="characters" hint="The six characters the gardener shows you." {...form.register("pickup_code")} error={fieldError} className="max-w-48 font-mono uppercase tracking-widest" />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={!!busy}>
          {busy === "collect" ? "Saving…" : "Confirm pickup"}
        </Button>
        <button type="button" className="text-moss-700 underline underline-offset-4" onClick={() => run("collect", {})} disabled={!!busy}>
          Collected without a code
        </button>
      </div>
    </Form>
  );
}
