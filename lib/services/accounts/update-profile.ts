import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { rolesOf, setRole, updateUser } from "@/db/users";
import { recordAudit } from "@/db/audit";
import type { ProfileInput } from "@/lib/validation/auth";
import type { Role } from "@/lib/auth/roles";
import { resolveContext, type Context } from "@/lib/context";

// Giving away material is open to anyone (trust comes from the verified badge and reviews),
// so a supplier request is granted at once. Selling live animals is not: a grower request
// waits for a moderator.
const GRANTED_AT_ONCE: Role[] = ["supplier"];

export async function updateProfile(userId: string, input: ProfileInput, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  await writeTransaction(q, async (trx) => {
    const home = input.home === undefined ? {} : input.home === null ? { home_place: null, home_lat: null, home_lng: null } : { home_place: input.home.label, home_lat: input.home.lat, home_lng: input.home.lng };
    await updateUser(userId, { display_name: input.display_name, unit_system: input.unit_system, reminders_opt_out: input.reminders_opt_out, ...home }, trx);
    const current = await rolesOf(userId, trx);
    for (const role of input.requested_roles) {
      const had = current.find((r) => r.role === role);
      if (had && had.status !== "refused") continue;
      const status = GRANTED_AT_ONCE.includes(role) ? "active" : "requested";
      await setRole(userId, role, status, trx);
      await recordAudit({ actor_id: userId, action: `role.${status === "active" ? "granted" : "requested"}`, subject_type: "user", subject_id: userId, after: { role, status } }, trx);
    }
  });
}
