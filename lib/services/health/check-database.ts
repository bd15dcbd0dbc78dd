import { resolveContext, type Context } from "@/lib/context";

/** Whether the database answers a trivial query. */
export async function databaseAnswers(ctx: Context = {}): Promise<boolean> {
  try {
    // Resolved inside the try: a database that cannot even be opened does not answer either.
    const { db: q } = resolveContext(ctx);
    await q.raw("select 1");
    return true;
  } catch {
    return false;
  }
}
