import { db, newId, nowIso, type Db } from "./index";
import type { InviteRow } from "./types";

const COLUMNS = ["id", "organisation_id", "email", "token_hash", "invited_by", "status", "expires_at", "accepted_by", "accepted_at", "created_at"];

export async function insertInvite(row: Pick<InviteRow, "organisation_id" | "email" | "token_hash" | "invited_by" | "expires_at">, q: Db = db()): Promise<InviteRow> {
  const full = { id: newId(), ...row, status: "pending", created_at: nowIso() };
  await q("organisation_invites").insert(full);
  return (await q("organisation_invites").first(COLUMNS).where({ id: full.id })) as InviteRow;
}

export async function findInviteByTokenHash(token_hash: string, q: Db = db()): Promise<InviteRow | undefined> {
  return (await q("organisation_invites").first(COLUMNS).where({ token_hash })) as InviteRow | undefined;
}

export async function findOrgInvite(id: string, organisationId: string, q: Db = db()): Promise<InviteRow | undefined> {
  return (await q("organisation_invites").first(COLUMNS).where({ id, organisation_id: organisationId })) as InviteRow | undefined;
}

/** Invitations still waiting for an answer. */
export async function pendingInvites(organisationId: string, now: string, q: Db = db()): Promise<InviteRow[]> {
  return q("organisation_invites").select(COLUMNS).where({ organisation_id: organisationId, status: "pending" }).andWhere("expires_at", ">", now).orderBy("created_at", "desc");
}

/** Moves pending invitations on; returns how many moved (0 when someone else got there first). */
export async function closeInvites(
  where: { id?: string; organisation_id: string; email?: string },
  to: "accepted" | "revoked",
  extra: Partial<InviteRow> = {},
  q: Db = db(),
): Promise<number> {
  return q("organisation_invites").where({ ...where, status: "pending" }).update({ status: to, ...extra });
}

export async function addMembership(organisationId: string, userId: string, orgRole: "owner" | "staff", q: Db = db()): Promise<void> {
  await q("memberships").insert({ organisation_id: organisationId, user_id: userId, org_role: orgRole, created_at: nowIso() }).onConflict(["organisation_id", "user_id"]).ignore();
}

export async function removeMembership(organisationId: string, userId: string, q: Db = db()): Promise<number> {
  return q("memberships").where({ organisation_id: organisationId, user_id: userId, org_role: "staff" }).delete();
}
