import { call, request } from "./http";
import * as councilDays from "@/app/api/council/giveaways/route";
import * as bookings from "@/app/api/giveaways/[id]/bookings/route";
import { addDays, localDate } from "@/lib/time/zoned";

/** A calendar day `n` days from today in the demo's zone. */
export const inDays = (n: number) => addDays(localDate(new Date(), "Europe/London"), n);

export const DEPOT = { lat: 52.2101, lng: 0.8512 };
export const DEPOT_ADDRESS = "Depot gate, 4 Mill Leat Lane, Fernhollow";

export function dayBody(over: Record<string, unknown> = {}) {
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

/** Creates a day through the staff route and returns the created view. */
export async function createDayAs(userId: string, over: Record<string, unknown> = {}) {
  const res = await call(councilDays.POST as never, await request("/api/council/giveaways", { body: dayBody(over), as: userId }));
  if (res.status !== 201) throw new Error(`day not created: ${res.status} ${JSON.stringify(res.json)}`);
  return res.json.giveaway as { id: string; slots: { id: string; starts_at: string; remaining: number; capacity: number }[]; exact: { address: string } };
}

export async function bookAs(userId: string | null, dayId: string, body: unknown) {
  return call(bookings.POST as never, await request(`/api/giveaways/${dayId}/bookings`, { body, as: userId }), { id: dayId });
}
