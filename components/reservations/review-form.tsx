"use client";
import { WORDS } from "./review-words";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { reviewSchema } from "@/lib/validation/reservations";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { useReservationAction } from "./use-reservation-action";
import { Form } from "@/components/ui/form";


/** One rating of the other side after a collection: 1–5 and an optional comment. */
export function ReviewForm({ id, subject }: { id: string; subject: string }) {
  const { run, busy, error } = useReservationAction(id);
  const form = useForm<z.input<typeof reviewSchema>>({ resolver: zodResolver(reviewSchema), defaultValues: { comment: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    await run("review", values);
  });
  const ratingError = form.formState.errors.rating?.message;
  const rating = useWatch({ control: form.control, name: "rating" });
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2 rounded-lg bg-litter-100 p-3">
      <fieldset aria-describedby={`rating-error-${id}`}>
        <legend className="font-medium">How was it with {subject}?</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {[1, 2, 3, 4, 5].map((n) => (
            <label key={n} className="flex min-h-11 cursor-pointer items-center gap-1 rounded-lg bg-white px-3 ring-1 ring-humus-300 has-[:checked]:bg-moss-600 has-[:checked]:text-white has-[:focus-visible]:outline has-[:focus-visible]:outline-[3px] has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-humus-900">
              {/* Set as a number by hand: react-hook-form's setValueAs does not apply to radios. */}
              <input type="radio" name={`rating-${id}`} value={n} className="sr-only" checked={rating === n} onChange={() => form.setValue("rating", n, { shouldValidate: form.formState.isSubmitted })} />
              <span aria-hidden="true">{WORDS[n]}</span>
              <span className="sr-only">{`${n} of 5, ${WORDS[n].toLowerCase()}`}</span>
            </label>
          ))}
        </div>
        <p id={`rating-error-${id}`} aria-live="polite" className="min-h-5 text-sm text-ember-600">
          {ratingError ?? ""}
        </p>
      </fieldset>
      <Field label="A line about it (optional)" id={`comment-${id}`} {...form.register("comment")} error={form.formState.errors.comment?.message} />
      <Button type="submit" disabled={!!busy} className="self-start">
        {busy ? "Sending…" : "Send review"}
      </Button>
      {error ? (
        <p role="alert" className="text-sm text-ember-600">
          {error.message}
        </p>
      ) : null}
    </Form>
  );
}
