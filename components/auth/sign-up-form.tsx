"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { signUpSchema } from "@/lib/validation/auth";
import { apiFetch, isApiError } from "@/lib/api/client";
import { Field } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { UnitSystemChoice } from "@/components/ui/unit-system-choice";
import { Form } from "@/components/ui/form";

type Values = z.input<typeof signUpSchema>;

export function SignUpForm({ callbackUrl, email = "" }: { callbackUrl?: string; email?: string } = {}) {
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(signUpSchema), defaultValues: { email, display_name: "", password: "", unit_system: "metric" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    try {
      const answer = await apiFetch<{ message: string }>("/api/users", { method: "POST", body: { ...values, ...(callbackUrl ? { callbackUrl } : {}) } });
      setSent(answer.message);
    } catch (err) {
      if (isApiError(err) && err.fields) {
        for (const [name, message] of Object.entries(err.fields)) form.setError(name as keyof Values, { message });
      }
      setError(isApiError(err) ? err.message : "We could not create the account. Please try again.");
    }
  });

  if (sent) {
    return (
      <Notice title="Check your inbox">
        {sent} The link works once, for 24 hours. Nothing there after a few minutes? Look in the spam folder, or join again to get a new one.
      </Notice>
    );
  }

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="Your name" autoComplete="name" hint="Shown to the people you collect from or give to." {...form.register("display_name")} error={form.formState.errors.display_name?.message} />
      <Field label="E-mail" type="email" autoComplete="email" {...form.register("email")} error={form.formState.errors.email?.message} />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="10 to 128 characters. A few unrelated words make a strong one; your name or e-mail do not."
        {...form.register("password")}
        error={form.formState.errors.password?.message}
      />
      <UnitSystemChoice field={form.register("unit_system")} className="pb-4" />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Creating your account…" : "Create my account"}
      </Button>
    </Form>
  );
}
