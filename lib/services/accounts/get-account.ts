import { findUserById } from "@/db/users";
import type { UserRow } from "@/db/types";

/** One account's row, for pages that show or prefill it. */
export async function getAccount(id: string): Promise<UserRow | undefined> {
  return findUserById(id);
}
