import "server-only";
import { notFound } from "next/navigation";
import type { SessionUser } from "@/lib/auth/current-user";
import { ApiError } from "@/lib/api/errors";
import { councilOf } from "./council-access";
import { daySheet, type DaySheet } from "./giveaway-sheet";

/** A staff page's day: another council's day, or none, is the not-found page. */
export async function sheetForPage(user: SessionUser, dayId: string): Promise<DaySheet> {
  try {
    return await daySheet(councilOf(user), dayId);
  } catch (err) {
    if (err instanceof ApiError && (err.code === "not_found" || err.code === "forbidden")) notFound();
    throw err;
  }
}
