"use client";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { z } from "zod";
import { profileSchema } from "@/lib/validation/auth";
import { apiFetch } from "@/lib/api/client";
import { Field } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { UnitSystemChoice } from "@/components/ui/unit-system-choice";
import type { Role } from "@/lib/auth/roles";
import { Form } from "@/components/ui/form";
import { PlaceSearch } from "@/components/ui/place-search";
import { useUnits } from "@/components/ui/units-context";
import { ErrorSummary, useErrorSummary } from "@/components/ui/error-summary";

type Values = z.input<typeof profileSchema>;

export function ProfileForm({ initial, roles, requested }: { initial: Values; roles: Role[]; requested: Role[] }) {
  const router = useRouter();
  const units = useUnits();
  const [saved, setSaved] = useState(false);
  // The error summary takes the focus on a failed submit.
  const form = useForm<Values>({ resolver: zodResolver(profileSchema), defaultValues: initial, shouldFocusError: false });
  const summary = useErrorSummary(form);
  const home = useWatch({ control: form.control, name: "home" });

  const onSubmit = form.handleSubmit(async (values) => {
    setSaved(false);
    summary.clear();
    try {
      await apiFetch("/api/me", { method: "PATCH", body: values });
      setSaved(true);
      // This device reads in the account's units from now on, as the header's switch would
      // (which also renders the page again).
      if (values.unit_system && values.unit_system !== units.system) units.setSystem(values.unit_system);
      else router.refresh();
    } catch (err) {
      summary.fail(err, "Saving failed. Please try again.");
    }
  }, summary.invalid);

  const roleBox = (role: "supplier" | "grower", label: string, note: string) => {
    const has = roles.includes(role);
    const waiting = requested.includes(role);
    return (
      <label className="flex items-start gap-3 rounded-lg p-2 ring-1 ring-humus-200">
        <input type="checkbox" value={role} disabled={has || waiting} defaultChecked={has || waiting} {...form.register("requested_roles")} className="mt-1 h-5 w-5" />
        <span>
          <span className="font-medium">{label}</span>
          <span className="block text-sm text-humus-600">{has ? "You have this." : waiting ? "Asked for — a moderator will look at it soon." : note}</span>
        </span>
      </label>
    );
  };

  return (
    <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      {saved ? <Notice title="Saved">Your profile is up to date.</Notice> : null}
      <ErrorSummary {...summary.props} />
      <Field label="Your name" {...form.register("display_name")} error={form.formState.errors.display_name?.message} />
      <UnitSystemChoice field={form.register("unit_system")} />
      <PlaceSearch
        label="Home place (optional)"
        name="home"
        hint="Where your beds are, when a bed has no place of its own: finding materials starts from here. Only you see it."
        value={home ?? null}
        onChange={(p) => form.setValue("home", { label: p.label, lat: p.lat, lng: p.lng }, { shouldDirty: true })}
        error={form.formState.errors.home?.message ?? form.formState.errors.home?.label?.message}
      />
      <label className="flex items-center gap-2">
        <input type="checkbox" {...form.register("reminders_opt_out")} className="h-5 w-5" /> Do not e-mail me bed reminders
      </label>
      <fieldset className="flex flex-col gap-2">
        <legend className="font-medium">I would also like to</legend>
        {roleBox("supplier", "Give material away or sell it", "Post leaves, cardboard, straw and more. Open to everyone.")}
        {roleBox("grower", "Sell composting worms", "Live cultures need a quick check by our team first.")}
      </fieldset>
      <Button type="submit" disabled={form.formState.isSubmitting} className="self-start">
        {form.formState.isSubmitting ? "Saving…" : "Save profile"}
      </Button>
    </Form>
  );
}
