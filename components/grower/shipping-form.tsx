"use client";
import { Controller, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { PAUSE_REASON_CHOICES, PAUSE_REASONS, shippingSchema, WEEKDAY_NAMES } from "@/lib/validation/grower";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";
import { inputClass } from "@/components/ui/field";

type Values = z.input<typeof shippingSchema>;

export function ShippingForm({ initial }: { initial: { ship_weekdays: number[]; paused: boolean; pause_reason: "heat" | "frost" | "other" | null; pause_note: string | null } }) {
  const action = useApiAction();
  const form = useForm<Values>({ resolver: zodResolver(shippingSchema), defaultValues: initial });
  const paused = useWatch({ control: form.control, name: "paused" });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    await action.run("/api/grower/shipping", { method: "PUT", body: values });
  });
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Shipping days">
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <Controller
        control={form.control}
        name="ship_weekdays"
        render={({ field }) => (
          <fieldset className="flex flex-col gap-2" aria-describedby="weekdays-error">
            <legend className="font-medium">Parcels go out on</legend>
            <p className="text-sm text-humus-600">Early in the week, so a parcel of live worms does not sit in a depot over the weekend.</p>
            <div className="flex flex-wrap gap-3">
              {WEEKDAY_NAMES.map((name, d) => (
                <label key={name} className="flex min-h-11 items-center gap-2">
                  <input
                    type="checkbox"
                    className="h-5 w-5"
                    checked={field.value.includes(d)}
                    onChange={(e) => field.onChange(e.target.checked ? [...field.value, d].sort() : field.value.filter((x) => x !== d))}
                  />
                  {name}
                </label>
              ))}
            </div>
            <p id="weekdays-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
              {errors.ship_weekdays?.message ?? ""}
            </p>
          </fieldset>
        )}
      />
      <label className="flex min-h-11 items-center gap-2 font-medium">
        <input type="checkbox" className="h-5 w-5" {...form.register("paused")} /> Pause posting for the weather
      </label>
      {paused ? (
        <div className="flex flex-col gap-2 rounded-lg bg-litter-100 p-3">
          <fieldset className="flex flex-wrap gap-4" aria-describedby="reason-error">
            <legend className="font-medium">Because of</legend>
            {PAUSE_REASONS.map((r) => (
              <label key={r} className="flex min-h-11 items-center gap-2">
                <input type="radio" value={r} className="h-5 w-5" {...form.register("pause_reason")} /> {PAUSE_REASON_CHOICES[r]}
              </label>
            ))}
          </fieldset>
          <p id="reason-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
            {errors.pause_reason?.message ?? ""}
          </p>
          <label htmlFor="pause-note" className="font-medium">
            A line for buyers (optional)
          </label>
          <input id="pause-note" className={inputClass} {...form.register("pause_note")} />
          <p className="text-sm text-humus-700">Buyers whose posted orders are waiting get an e-mail with this line when you pause, and another when you resume posting.</p>
        </div>
      ) : null}
      <Button type="submit" className="self-start" disabled={action.busy}>
        {action.busy ? "Saving…" : "Save shipping"}
      </Button>
    </Form>
  );
}
