import type { Knex } from "knex";
import { BAG_M3 } from "../lib/calc/facts";
import { approximatePoint, placeOwner } from "../lib/geo/approximate";
import { zonedToUtc } from "../lib/time/zoned";
import { seedId } from "./ids";
import { TOWN } from "./town";

// Fernhollow Town Council's giveaway days: one past leaf day whose households were checked
// in (so the council's diversion report has real rows), and one coming up to book. Fixed
// ids and "insert or ignore", like the rest of the demo.

const CREATED = "2026-11-01T09:00:00.000Z";
const TZ = "Europe/London";
const DEPOT = { lat: TOWN.centre.lat + 0.006, lng: TOWN.centre.lng + 0.009, address: "Lantern Hill depot gate, Lantern Hill, Fernhollow" };

interface SeedDay {
  key: string;
  material: "leaves" | "wood_chips" | "compost";
  title: string;
  date: string;
  unit: "bags" | "m3";
  cap: number;
  notes: string;
  slots: [string, string, number][];
  checkedIn?: [string, number][];
}

const DAYS: SeedDay[] = [
  {
    key: "giveaway:november-leaves",
    material: "leaves",
    title: "Park leaf day at the Lantern Hill depot",
    date: "2026-11-14",
    unit: "bags",
    cap: 6,
    notes: "Leaves from the park paths and lawns only, kept apart from street sweepings.",
    slots: [
      ["09:00", "10:00", 10],
      ["10:00", "11:00", 10],
    ],
    checkedIn: [
      ["gardener", 6],
      ["maeve", 4],
      ["tobias", 5],
      ["priya", 3],
    ],
  },
  {
    key: "giveaway:january-chips",
    material: "wood_chips",
    title: "Wood chips from the winter tree work",
    date: "2027-01-16",
    unit: "m3",
    cap: 1,
    notes: "Fresh hardwood chips for paths and the top of beds. Bring a trailer or sturdy sacks and a shovel.",
    slots: [
      ["09:00", "09:30", 8],
      ["09:30", "10:00", 8],
      ["10:00", "10:30", 8],
      ["10:30", "11:00", 8],
    ],
  },
];

export async function seedCommunity(trx: Knex.Transaction | Knex): Promise<void> {
  const org = seedId("org:council");
  for (const d of DAYS) {
    const id = seedId(d.key);
    const approx = approximatePoint({ owner: placeOwner({ organisation_id: org }), lat: DEPOT.lat, lng: DEPOT.lng });
    await trx("giveaway_days")
      .insert({
        id,
        organisation_id: org,
        created_by: seedId("user:council"),
        material_code: d.material,
        title: d.title,
        notes: d.notes,
        date: d.date,
        time_zone: TZ,
        lat: DEPOT.lat,
        lng: DEPOT.lng,
        address: DEPOT.address,
        approx_lat: approx.lat,
        approx_lng: approx.lng,
        unit: d.unit,
        unit_size: d.unit === "bags" ? BAG_M3 : null,
        household_cap: d.cap,
        booking_opens_at: CREATED,
        booking_closes_at: zonedToUtc(d.date, "08:00", TZ).toISOString(),
        cancel_cutoff_hours: 12,
        deposit_cents: 0,
        currency: TOWN.currency,
        status: "scheduled",
        created_at: CREATED,
        updated_at: CREATED,
      })
      .onConflict("id")
      .ignore();
    const checked = d.checkedIn ?? [];
    for (const [i, [start, end, capacity]] of d.slots.entries()) {
      const slotId = seedId(`${d.key}:slot:${i}`);
      // Households are spread over the slots in turn; the count matches the bookings below.
      const mine = checked.filter((_, j) => j % d.slots.length === i);
      await trx("giveaway_slots")
        .insert({ id: slotId, day_id: id, starts_at: zonedToUtc(d.date, start, TZ).toISOString(), ends_at: zonedToUtc(d.date, end, TZ).toISOString(), capacity, booked: mine.length, created_at: CREATED })
        .onConflict("id")
        .ignore();
      for (const [person, quantity] of mine) {
        const at = zonedToUtc(d.date, start, TZ).toISOString();
        await trx("giveaway_bookings")
          .insert({
            id: seedId(`${d.key}:booking:${person}`),
            day_id: id,
            slot_id: slotId,
            user_id: seedId(`user:${person}`),
            quantity,
            status: "checked_in",
            deposit_cents: 0,
            deposit_status: "none",
            currency: TOWN.currency,
            checked_in_at: at,
            checked_in_by: seedId("user:council2"),
            created_at: CREATED,
            updated_at: at,
          })
          .onConflict("id")
          .ignore();
      }
    }
  }
  await trx("grower_shipping")
    .insert({ user_id: seedId("user:grower"), ship_weekdays: "1,2", paused: false, pause_reason: null, pause_note: null, updated_at: CREATED })
    .onConflict("user_id")
    .ignore();
}
