"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { cultureSchema } from "@/lib/validation/grower";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";

type Values = z.infer<typeof cultureSchema>;

/** The species (required) and how a culture reaches the buyer, for one worm listing. */
export function CultureForm({ listingId, title, initial }: { listingId: string; title: string; initial: { species: string | null; ships: boolean; pickup: boolean } }) {
  const action = useApiAction();
  const form = useForm<Values>({ resolver: zodResolver(cultureSchema), defaultValues: { species: initial.species ?? "", ships: initial.ships, pickup: initial.pickup } });
  const errors = form.formState.errors;
  return (
    <Form
      noValidate
      aria-label={`Culture details for ${title}`}
      className="flex flex-col gap-2"
      onSubmit={form.handleSubmit(async (v) => {
        await action.run(`/api/grower/listings/${listingId}/culture`, { method: "PUT", body: v });
      })}
    >
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <Field id={`species-${listingId}`} label="Species (required)" hint="The scientific name, e.g. Eisenia fetida." {...form.register("species")} error={errors.species?.message} />
      <div className="flex flex-wrap gap-4">
        <label className="flex min-h-11 items-center gap-2">
          <input type="checkbox" className="h-5 w-5" {...form.register("ships")} /> Posted
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input type="checkbox" className="h-5 w-5" {...form.register("pickup")} /> Collected
        </label>
      </div>
      <p aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {errors.ships?.message ?? ""}
      </p>
      <Button type="submit" variant="secondary" className="self-start" disabled={action.busy}>
        Save<span className="sr-only"> culture details for {title}</span>
      </Button>
    </Form>
  );
}
