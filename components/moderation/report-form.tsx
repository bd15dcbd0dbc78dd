"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { apiFetch, isApiError } from "@/lib/api/client";
import { REPORT_REASON_LABELS, REPORT_REASONS, reportSchema } from "@/lib/validation/moderation";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Form } from "@/components/ui/form";
import { inputClass } from "@/components/ui/field";

type Values = z.infer<typeof reportSchema>;

export interface ReportFormProps {
  /** Exactly one of the two: the listing or the person being reported. */
  listingId?: string;
  userId?: string;
  /** What is being reported, in words ("the listing “Leaf bags”"). */
  subjectLabel: string;
  onDone?: () => void;
}

/** Report a listing or a person to the moderators. Reusable: the listing page can drop it in. */
export function ReportForm({ listingId, userId, subjectLabel, onDone }: ReportFormProps) {
  const [sent, setSent] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<Values>({
    resolver: zodResolver(reportSchema),
    defaultValues: { listing_id: listingId, user_id: userId, reason: undefined as unknown as Values["reason"], text: "" },
  });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    try {
      await apiFetch("/api/reports", { body: values });
      setSent(true);
      onDone?.();
    } catch (err) {
      if (isApiError(err) && err.fields) for (const [k, m] of Object.entries(err.fields)) form.setError(k as keyof Values, { message: m });
      setError(isApiError(err) ? err.message : "The report did not go through. Please try again.");
    }
  });
  if (sent) {
    return (
      <Notice title="Thank you — the report is with our moderators">
        We look at every report. When we have closed it you get an e-mail saying what we did.
      </Notice>
    );
  }
  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label={`Report ${subjectLabel}`}>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <fieldset className="flex flex-col gap-2" aria-describedby="reason-error">
        <legend className="font-medium">What is wrong with {subjectLabel}?</legend>
        {REPORT_REASONS.map((r) => (
          <label key={r} className="flex min-h-11 items-center gap-3">
            <input type="radio" value={r} {...form.register("reason")} className="h-5 w-5" />
            {REPORT_REASON_LABELS[r]}
          </label>
        ))}
        <p id="reason-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
          {errors.reason?.message ?? ""}
        </p>
      </fieldset>
      <label htmlFor="report-text" className="font-medium">
        What happened
      </label>
      <p id="report-text-hint" className="text-sm text-humus-600">
        Dates, what you saw, and anything that would help us check. At least 10 characters.
      </p>
      <textarea
        id="report-text"
        rows={5}
        aria-invalid={errors.text ? true : undefined}
        aria-describedby="report-text-hint report-text-error"
        className={inputClass}
        {...form.register("text")}
      />
      <p id="report-text-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {errors.text?.message ?? errors.listing_id?.message ?? errors.user_id?.message ?? ""}
      </p>
      <Button type="submit" className="self-start" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Sending…" : "Send the report"}
      </Button>
    </Form>
  );
}
