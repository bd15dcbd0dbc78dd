import "server-only";
import { notFound } from "next/navigation";
import type { SessionUser } from "@/lib/auth/current-user";
import { ApiError } from "@/lib/api/errors";
import { councilOf } from "@/lib/auth/council-access";
import { daySheet } from "@/lib/services/giveaways/get-day-sheet";
import type { DaySheet } from "@/lib/giveaways/sheet-csv";
import type { Context } from "@/lib/context";

/** A staff page's day: another council's day, or none, is the not-found page. */
export async function sheetForPage(user: SessionUser, dayId: string, ctx: Context = {}): Promise<DaySheet> {
  try {
    return await daySheet(councilOf(user), dayId, ctx);
  } catch (err) {
    if (err instanceof ApiError && (err.code === "not_found" || err.code === "forbidden")) notFound();
    throw err;
  }
}
