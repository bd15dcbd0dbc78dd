import { byteOrder } from "./dialect";
import { db, type Db } from "./index";

export async function membersOf(organisationId: string, q: Db = db()) {
  return q("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .select("u.id", "u.display_name as name", "u.email", "m.org_role", "m.created_at")
    .where("m.organisation_id", organisationId)
    .orderBy([{ column: "m.org_role", order: "asc" }, { column: byteOrder(q, "u.display_name") }]);
}

export async function pendingRoleRequests(q: Db = db()) {
  return q("user_roles as r")
    .join("users as u", "u.id", "r.user_id")
    .select("u.id as user_id", "u.display_name as name", "u.email", "r.role", "r.created_at")
    .where("r.status", "requested")
    .orderBy("r.created_at");
}

export async function findOrganisation(id: string, q: Db = db()): Promise<{ id: string; name: string; kind: string } | undefined> {
  return q("organisations").first("id", "name", "kind").where({ id });
}
