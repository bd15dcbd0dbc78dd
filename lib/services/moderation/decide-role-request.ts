import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { rolesOf, setRole } from "@/db/users";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { Role } from "@/lib/auth/roles";
import { resolveContext, type Context } from "@/lib/context";

export async function decideRoleRequest(moderatorId: string, userId: string, role: Role, decision: "approve" | "refuse", ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const current = (await rolesOf(userId, trx)).find((r) => r.role === role);
    if (!current) throw notFound("That request");
    if (current.status !== "requested") throw new ApiError("invalid_state", "That request has already been decided.");
    const status = decision === "approve" ? "active" : "refused";
    await setRole(userId, role, status, trx);
    await recordAudit({ actor_id: moderatorId, action: `role.${decision}`, subject_type: "user", subject_id: userId, before: { role, status: current.status }, after: { role, status } }, trx);
    return { user_id: userId, role, status };
  });
}
