import { z } from "zod";
import { REQUESTABLE_ROLES } from "@/lib/auth/roles";

export const roleDecisionSchema = z.object({
  role: z.enum(REQUESTABLE_ROLES, { error: "Choose the role being decided." }),
  decision: z.enum(["approve", "refuse"], { error: "Choose approve or refuse." }),
});
