// The viewer's unit system: metric or imperial, for visitors too. It is kept in a cookie
// (the header's switch sets it), and a signed-in person's profile setting is the default
// on a device that has no cookie yet. Pure: the server reads it per request, the switch
// writes it in the browser.
import type { UnitSystem } from "@/lib/calc/units";

export const UNITS_COOKIE = "duffbank_units";
/** A year: a choice of units outlives a session. */
export const UNITS_COOKIE_MAX_AGE_S = 365 * 24 * 3600;

export function parseUnitSystem(value: string | null | undefined): UnitSystem | null {
  return value === "metric" || value === "imperial" ? value : null;
}

/** The cookie's value, else the profile's, else metric. */
export function unitsFor(cookie: string | null | undefined, profile: UnitSystem | null | undefined): UnitSystem {
  return parseUnitSystem(cookie) ?? profile ?? "metric";
}

/** The Set-Cookie attributes for the choice (readable by the page; nothing secret in it). */
export function unitsCookie(system: UnitSystem): string {
  return `${UNITS_COOKIE}=${system}; Path=/; Max-Age=${UNITS_COOKIE_MAX_AGE_S}; SameSite=Lax`;
}
