import { z } from "zod";
import { emailSchema } from "./auth";

export const inviteSchema = z.object({ email: emailSchema });

export const acceptInviteSchema = z.object({
  token: z.string({ error: "The invitation link is incomplete." }).trim().min(20, "The invitation link is incomplete.").max(200, "The invitation link is not valid."),
});

export type InviteInput = z.infer<typeof inviteSchema>;
