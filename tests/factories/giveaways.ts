// Giveaway days are made through the staff route (their slots and places are worked out
// there), so these build the request body and post it. The routes are imported when first
// used, so importing the factories loads no route module (and reads no environment) early.

import { addDays, localDate } from "@/lib/time/zoned";

/** A calendar day `n` days from today in the demo's zone. */
export const inDays = (n: number) => addDays(localDate(new Date(), "Europe/London"), n);

export const DEPOT = { lat: 52.2101, lng: 0.8512 };
export const DEPOT_ADDRESS = "Depot gate, 4 Mill Leat Lane, Fernhollow";

/** A valid POST /api/council/giveaways body: leaf bags at the depot a week from today, two slots. */
export function giveawayBody(over: Record<string, unknown> = {}) {
  return {
    material: "leaves",
    title: "Leaf day at the depot",
    date: inDays(7),
    location: DEPOT,
    address: DEPOT_ADDRESS,
    unit: "bags",
    household_cap: 6,
    // No deposit unless a test asks for one: a deposit day needs the Stripe fake (tests/helpers/payments.ts).
    deposit_cents: 0,
    slots: [
      { start: "09:00", end: "09:30", capacity: 2 },
      { start: "09:30", end: "10:00", capacity: 1 },
    ],
    ...over,
  };
}

/** A giveaway day posted by council user `userId` through the staff route; its created view. */
export async function createGiveaway(userId: string, over: Record<string, unknown> = {}) {
  const { call, request } = await import("../helpers/http");
  const councilDays = await import("@/app/api/council/giveaways/route");
  const res = await call(councilDays.POST as never, await request("/api/council/giveaways", { body: giveawayBody(over), as: userId }));
  if (res.status !== 201) throw new Error(`giveaway not created: ${res.status} ${JSON.stringify(res.json)}`);
  return res.json.giveaway as { id: string; slots: { id: string; starts_at: string; remaining: number; capacity: number }[]; exact: { address: string } };
}

/** Books a slot on a day through the public route (`userId` null: signed out); the response. */
export async function bookAs(userId: string | null, dayId: string, body: unknown) {
  const { call, request } = await import("../helpers/http");
  const bookings = await import("@/app/api/giveaways/[id]/bookings/route");
  return call(bookings.POST as never, await request(`/api/giveaways/${dayId}/bookings`, { body, as: userId }), { id: dayId });
}
