import "server-only";
import { cookies } from "next/headers";
import type { UnitSystem } from "@/lib/calc/units";
import type { SessionUser } from "@/lib/auth/current-user";
import { UNITS_COOKIE, unitsFor } from "./preference";

/** The unit system the person looking at this page reads in (lib/units/preference.ts). */
export async function viewerUnits(user: Pick<SessionUser, "unit_system"> | null | undefined): Promise<UnitSystem> {
  return unitsFor((await cookies()).get(UNITS_COOKIE)?.value, user?.unit_system);
}
