import { db } from "@/db/index";

/** Whether the database answers a trivial query. */
export async function databaseAnswers(): Promise<boolean> {
  try {
    await db().raw("select 1");
    return true;
  } catch {
    return false;
  }
}
