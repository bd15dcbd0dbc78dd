import { pendingRoleRequests } from "@/db/organisations";

/** Requests for a role that wait for a moderator's decision. */
export async function listRoleRequests() {
  return pendingRoleRequests();
}
