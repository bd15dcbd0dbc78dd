"use client";
import { formatMoney } from "@/lib/format/money";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { cancelGiveawaySchema } from "@/lib/validation/giveaways";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";
import { inputClass } from "@/components/ui/field";

type Values = z.infer<typeof cancelGiveawaySchema>;

export function CancelDayForm({ dayId, booked, depositCents }: { dayId: string; booked: number; depositCents: number }) {
  const action = useApiAction();
  const form = useForm<Values>({ resolver: zodResolver(cancelGiveawaySchema), defaultValues: { reason: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    if (!window.confirm(`Call the day off? ${booked} booked ${booked === 1 ? "household is" : "households are"} e-mailed and every booking is cancelled.`)) return;
    await action.run(`/api/council/giveaways/${dayId}/cancel`, { body: values, idempotent: true });
  });
  const err = form.formState.errors.reason?.message;
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
      <p className="text-sm text-humus-700">
        Everyone booked gets an e-mail with your reason, and their booking is cancelled.
        {depositCents ? ` Every ${formatMoney(depositCents, "eur")} no-show deposit held on a card is released, and any deposit page still open is closed.` : ""}
      </p>
      <label htmlFor="field-reason" className="font-medium">
        Reason, for the e-mail
      </label>
      <textarea id="field-reason" rows={2} aria-invalid={err ? true : undefined} aria-describedby="field-reason-error" className={inputClass} {...form.register("reason")} />
      <p id="field-reason-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {err ?? ""}
      </p>
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <Button type="submit" variant="danger" className="self-start" disabled={action.busy}>
        {action.busy ? "Calling it off…" : "Call the day off"}
      </Button>
    </Form>
  );
}
