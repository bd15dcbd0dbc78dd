import { z } from "zod";
import { REQUESTABLE_ROLES } from "@/lib/auth/roles";

const email = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .min(1, "Enter your e-mail address.")
  .max(320, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.org." }));

/** A person's e-mail address, trimmed and checked. */
export const emailSchema = email;

export const signInSchema = z.object({
  email,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
});

export const signUpSchema = z.object({
  email,
  display_name: z
    .string({ error: "Tell us what to call you." })
    .trim()
    .min(2, "Use at least 2 characters.")
    .max(80, "Use at most 80 characters."),
  password: z
    .string({ error: "Choose a password." })
    .min(10, "Use at least 10 characters.")
    .max(200, "Use at most 200 characters."),
  unit_system: z.enum(["metric", "imperial"]).default("metric"),
});

export const magicLinkSchema = z.object({ email });

export const profileSchema = z.object({
  display_name: signUpSchema.shape.display_name,
  unit_system: z.enum(["metric", "imperial"], { error: "Choose metric or imperial." }),
  reminders_opt_out: z.boolean().default(false),
  requested_roles: z.array(z.enum(REQUESTABLE_ROLES, { error: "That role cannot be requested." })).max(2).default([]),
});

export type SignUpInput = z.infer<typeof signUpSchema>;
export type ProfileInput = z.infer<typeof profileSchema>;
