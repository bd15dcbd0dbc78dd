"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { z } from "zod";
import { magicLinkSchema, signInSchema } from "@/lib/validation/auth";
import { Field } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Form } from "@/components/ui/form";
import { authPost } from "./auth-post";

type SignInValues = z.infer<typeof signInSchema>;

const WRONG = "That e-mail and password do not match an account. Check both and try again.";

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string | null }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(initialError ?? null);
  const form = useForm<SignInValues>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    const res = await authPost("callback/credentials", { ...values, callbackUrl });
    if (!res.ok) {
      if (res.error === "suspended") setError("This account is suspended. Contact the Duffbank team.");
      else if (res.error === "rate_limited") setError(res.message ?? "Too many attempts. Try again in a few minutes.");
      else if (res.error === "network") setError(res.message ?? WRONG);
      else setError(WRONG);
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  });

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2" aria-labelledby="password-title">
      <h2 id="password-title" className="text-lg font-semibold">
        With your password
      </h2>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="E-mail" type="email" autoComplete="email" {...form.register("email")} error={form.formState.errors.email?.message} />
      <Field label="Password" type="password" autoComplete="current-password" {...form.register("password")} error={form.formState.errors.password?.message} />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
    </Form>
  );
}

type LinkValues = z.infer<typeof magicLinkSchema>;

export function MagicLinkForm({ callbackUrl }: { callbackUrl: string }) {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<LinkValues>({ resolver: zodResolver(magicLinkSchema), defaultValues: { email: "" } });

  const onSubmit = form.handleSubmit(async ({ email }) => {
    setError(null);
    const res = await authPost("signin/email", { email, callbackUrl });
    if (!res.ok) {
      setError(res.message ?? "We could not send a link just now. Please try again.");
      return;
    }
    setSentTo(email);
  });

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2" aria-labelledby="link-title">
      <h2 id="link-title" className="text-lg font-semibold">
        Or with a link by e-mail
      </h2>
      {sentTo ? (
        <Notice title="Check your inbox">
          If {sentTo} has a Duffbank account, a sign-in link is on its way. It works once, for 15 minutes. New here? The e-mail says how to join.
        </Notice>
      ) : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field id="link-email" label="E-mail for the link" type="email" autoComplete="email" {...form.register("email")} error={form.formState.errors.email?.message} />
      <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Sending…" : "E-mail me a link"}
      </Button>
    </Form>
  );
}
