import { db, newId, nowIso } from "@/db/index";
import { setRole } from "@/db/users";
import type { Role } from "@/lib/auth/roles";

let n = 0;

export interface UserOpts {
  roles?: Role[];
  email?: string;
  display_name?: string;
  password_hash?: string | null;
  /** A council user joins this organisation as staff; without it one is made with them as its owner. */
  organisation_id?: string;
  suspended?: boolean;
  /** Confirmed unless asked otherwise: reserving and posting need a confirmed address. */
  unconfirmed?: boolean;
}

/** A user with the given roles (a gardener by default), written straight to the database. */
export async function createUser(opts: UserOpts = {}) {
  const id = newId();
  const now = nowIso();
  const k = ++n;
  const email = opts.email ?? `user${k}-${id.slice(0, 6)}@example.test`;
  await db()("users").insert({
    id,
    email,
    display_name: opts.display_name ?? `Test person ${k}`,
    password_hash: opts.password_hash ?? null,
    email_verified_at: opts.unconfirmed ? null : now,
    unit_system: "metric",
    reminders_opt_out: false,
    suspended_at: opts.suspended ? now : null,
    created_at: now,
    updated_at: now,
  });
  const roles = opts.roles ?? ["gardener"];
  for (const role of roles) await setRole(id, role, "active");
  let organisation_id = opts.organisation_id;
  if (roles.includes("council")) {
    if (!organisation_id) {
      organisation_id = newId();
      await db()("organisations").insert({ id: organisation_id, name: `Test council ${k}`, kind: "council", created_at: now });
    }
    await db()("memberships").insert({ organisation_id, user_id: id, org_role: opts.organisation_id ? "staff" : "owner", created_at: now });
  }
  return { id, email, organisation_id };
}
