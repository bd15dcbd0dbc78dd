import { db, newId, nowIso } from "@/db/index";
import { setRole } from "@/db/users";
import type { Role } from "@/lib/auth/roles";

let n = 0;

/** A user with the given roles; a council user gets an organisation (or joins `orgId`). */
export async function createUser(opts: { roles?: Role[]; email?: string; orgId?: string; suspended?: boolean; password_hash?: string } = {}) {
  const id = newId();
  const now = nowIso();
  const email = opts.email ?? `user${++n}-${id.slice(0, 6)}@example.test`;
  await db()("users").insert({
    id,
    email,
    display_name: `Test person ${n}`,
    password_hash: opts.password_hash ?? null,
    unit_system: "metric",
    reminders_opt_out: false,
    suspended_at: opts.suspended ? now : null,
    created_at: now,
    updated_at: now,
  });
  for (const role of opts.roles ?? ["gardener"]) await setRole(id, role, "active");
  let orgId = opts.orgId;
  if ((opts.roles ?? []).includes("council")) {
    if (!orgId) {
      orgId = newId();
      await db()("organisations").insert({ id: orgId, name: `Test council ${n}`, kind: "council", created_at: now });
    }
    await db()("memberships").insert({ organisation_id: orgId, user_id: id, org_role: opts.orgId ? "staff" : "owner", created_at: now });
  }
  return { id, email, orgId };
}
