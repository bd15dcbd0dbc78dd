import { membersOf } from "@/db/organisations";

/** The staff of a council, for its own members. */
export async function listMembers(organisationId: string) {
  return membersOf(organisationId);
}
