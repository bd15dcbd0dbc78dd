import { db, newId, nowIso, type Db } from "./index";
import type { MembershipRow, UserRoleRow, UserRow } from "./types";
import type { Role } from "@/lib/auth/roles";

const USER_COLUMNS: string[] = [
  "id",
  "email",
  "email_verified_at",
  "password_hash",
  "display_name",
  "unit_system",
  "reminders_opt_out",
  "suspended_at",
  "verified_at",
  "home_place",
  "home_lat",
  "home_lng",
  "created_at",
  "updated_at",
];

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserByEmail(email: string, q: Db = db()): Promise<UserRow | undefined> {
  return (await q("users").first(USER_COLUMNS).where("email", normaliseEmail(email))) as UserRow | undefined;
}

export async function findUserById(id: string, q: Db = db()): Promise<UserRow | undefined> {
  return (await q("users").first(USER_COLUMNS).where("id", id)) as UserRow | undefined;
}

export async function insertUser(
  input: { email: string; display_name: string; password_hash?: string | null; email_verified_at?: string | null; unit_system?: "metric" | "imperial" },
  q: Db = db(),
): Promise<UserRow> {
  const now = nowIso();
  const row = {
    id: newId(),
    email: normaliseEmail(input.email),
    display_name: input.display_name,
    password_hash: input.password_hash ?? null,
    email_verified_at: input.email_verified_at ?? null,
    unit_system: input.unit_system ?? "metric",
    reminders_opt_out: false,
    created_at: now,
    updated_at: now,
  };
  await q("users").insert(row);
  return (await findUserById(row.id, q))!;
}

export async function updateUser(
  id: string,
  patch: Partial<Pick<UserRow, "display_name" | "unit_system" | "reminders_opt_out" | "email_verified_at" | "suspended_at" | "verified_at" | "home_place" | "home_lat" | "home_lng">>,
  q: Db = db(),
): Promise<void> {
  await q("users").where({ id }).update({ ...patch, updated_at: nowIso() });
}

export async function setPasswordHash(id: string, passwordHash: string, q: Db = db()): Promise<void> {
  await q("users").where({ id }).update({ password_hash: passwordHash, updated_at: nowIso() });
}

export async function rolesOf(userId: string, q: Db = db()): Promise<UserRoleRow[]> {
  return q<UserRoleRow>("user_roles").select("user_id", "role", "status", "created_at").where({ user_id: userId });
}

export async function setRole(userId: string, role: Role, status: UserRoleRow["status"], q: Db = db()): Promise<void> {
  await q("user_roles")
    .insert({ user_id: userId, role, status, created_at: nowIso() })
    .onConflict(["user_id", "role"])
    .merge({ status });
}

export async function removeRole(userId: string, role: Role, q: Db = db()): Promise<void> {
  await q("user_roles").where({ user_id: userId, role }).delete();
}

export async function membershipsOf(userId: string, q: Db = db()): Promise<(MembershipRow & { name: string; kind: string })[]> {
  return q("memberships as m")
    .join("organisations as o", "o.id", "m.organisation_id")
    .select("m.organisation_id", "m.user_id", "m.org_role", "m.created_at", "o.name", "o.kind")
    .where("m.user_id", userId)
    .orderBy("m.created_at");
}
