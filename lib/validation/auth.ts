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
  // Longer than any password one can set (128), so a long guess is simply wrong.
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(1024),
});

/** A new password: 10 to 128 characters, every one of them counting (scrypt reads them all). How guessable it is is checked on the server (lib/auth/password-strength.ts). */
export const newPasswordSchema = z
  .string({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .max(128, "Use at most 128 characters.");

export const signUpSchema = z.object({
  email,
  display_name: z
    .string({ error: "Tell us what to call you." })
    .trim()
    .min(2, "Use at least 2 characters.")
    .max(80, "Use at most 80 characters."),
  password: newPasswordSchema,
  unit_system: z.enum(["metric", "imperial"]).default("metric"),
  /** Where the link in the confirmation e-mail leads after signing in (a path on this site). */
  callbackUrl: z.string().max(2048).optional(),
});

export const changePasswordSchema = z.object({
  current_password: z.string({ error: "Enter your current password." }).max(1024).default(""),
  new_password: newPasswordSchema,
});

export const magicLinkSchema = z.object({ email });

export const profileSchema = z.object({
  display_name: signUpSchema.shape.display_name,
  unit_system: z.enum(["metric", "imperial"], { error: "Choose metric or imperial." }),
  reminders_opt_out: z.boolean().default(false),
  requested_roles: z.array(z.enum(REQUESTABLE_ROLES, { error: "That role cannot be requested." })).max(2).default([]),
  // Where beds are planned from when they have no place of their own: a place found by name
  // (GET /api/places) or the device's position. null clears it; absent leaves it as it is.
  home: z
    .object(
      {
        label: z.string({ error: "Name the place." }).trim().min(1, "Name the place.").max(300, "Keep the name under 300 characters."),
        lat: z.number({ error: "Choose a place from the list." }).min(-90, "Choose a place from the list.").max(90, "Choose a place from the list."),
        lng: z.number({ error: "Choose a place from the list." }).min(-180, "Choose a place from the list.").max(180, "Choose a place from the list."),
      },
      { error: "Choose a place from the list." },
    )
    .nullable()
    .optional(),
});

export type SignUpInput = z.infer<typeof signUpSchema>;
export type ProfileInput = z.infer<typeof profileSchema>;
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
