"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signOut } from "next-auth/react";
import { z } from "zod";
import { changePasswordSchema } from "@/lib/validation/auth";
import { apiFetch, isApiError } from "@/lib/api/client";
import { Field } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Form } from "@/components/ui/form";

type PasswordValues = z.input<typeof changePasswordSchema>;

/** The "confirm your address" reminder, with the link sent again on request. */
export function ConfirmEmailNotice({ email }: { email: string }) {
  const [state, setState] = useState<"idle" | "sending" | "sent">("idle");
  const [error, setError] = useState<string | null>(null);
  const resend = async () => {
    setState("sending");
    setError(null);
    try {
      await apiFetch("/api/me/confirmation", { method: "POST" });
      setState("sent");
    } catch (err) {
      setState("idle");
      setError(isApiError(err) ? err.message : "We could not send it. Please try again.");
    }
  };
  return (
    <Notice tone="caution" title="Confirm your e-mail address">
      <p>
        Follow the link we sent to {email} to reserve material or post a listing. {state === "sent" ? "A new link is on its way." : null}
      </p>
      {error ? <p className="text-ember-800">{error}</p> : null}
      {state !== "sent" ? (
        <Button variant="secondary" className="mt-2" onClick={() => void resend()} disabled={state === "sending"}>
          {state === "sending" ? "Sending…" : "Send the link again"}
        </Button>
      ) : null}
    </Notice>
  );
}

/** A new password, and "sign out everywhere": both end every session, this one too. */
export function AccountSecurity({ hasPassword }: { hasPassword: boolean }) {
  const [error, setError] = useState<string | null>(null);
  const form = useForm<PasswordValues>({ resolver: zodResolver(changePasswordSchema), defaultValues: { current_password: "", new_password: "" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    try {
      await apiFetch("/api/me/password", { method: "POST", body: values });
    } catch (err) {
      if (isApiError(err) && err.fields) {
        for (const [name, message] of Object.entries(err.fields)) form.setError(name as keyof PasswordValues, { message });
      }
      setError(isApiError(err) ? err.message : "Changing the password failed. Please try again.");
      return;
    }
    await signOut({ callbackUrl: "/sign-in?changed=password" });
  });

  const everywhere = async () => {
    if (!window.confirm("Sign out on every device and browser, this one too?")) return;
    try {
      await apiFetch("/api/me/sessions", { method: "DELETE" });
    } catch (err) {
      setError(isApiError(err) ? err.message : "Signing out everywhere failed. Please try again.");
      return;
    }
    await signOut({ callbackUrl: "/sign-in?changed=everywhere" });
  };

  return (
    <section aria-labelledby="security-title" className="flex flex-col gap-4">
      <h2 id="security-title" className="text-lg font-semibold">
        Password and sign-ins
      </h2>
      <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-2" aria-label="Change your password">
        {error ? <Notice tone="error">{error}</Notice> : null}
        {hasPassword ? (
          <Field label="Current password" type="password" autoComplete="current-password" {...form.register("current_password")} error={form.formState.errors.current_password?.message} />
        ) : null}
        <Field
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="10 to 128 characters. Changing it signs you out everywhere."
          {...form.register("new_password")}
          error={form.formState.errors.new_password?.message}
        />
        <Button type="submit" className="self-start" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Changing…" : "Change password"}
        </Button>
      </Form>
      <div className="flex flex-col gap-2 border-t border-humus-200 pt-4">
        <p className="text-sm text-humus-700">Signed in on a shared computer, or lost a phone? End every session of this account.</p>
        <Button variant="secondary" className="self-start" onClick={() => void everywhere()}>
          Sign out everywhere
        </Button>
      </div>
    </section>
  );
}
