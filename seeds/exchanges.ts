import type { Knex } from "knex";
import { seedId } from "./ids";
import { demoListings, type DemoListing } from "./listings";
import { TOWN } from "./town";

// A few pickups that already happened in November, so the home page's kept-from-the-bin
// figure, the suppliers' reports and the reviews on their listings have something real to
// show. Free listings only (no payments to match in the Stripe fake). Fixed ids; a pickup
// moves its listing's collected quantity only when its row is first written, so seeding
// twice changes nothing.

interface PastPickup {
  key: string;
  /** The listing: the last copy of this owner's listings of this material. */
  owner: string;
  material: DemoListing["material"];
  gardener: string;
  quantity: number;
  collectedOn: string;
  review?: { rating: number; comment: string };
}

const PICKUPS: PastPickup[] = [
  { key: "pickup:ines-boxes", owner: "cycles", material: "cardboard", gardener: "gardener", quantity: 8, collectedOn: "2026-11-07T10:30:00.000Z", review: { rating: 5, comment: "Big clean boxes, tape already off." } },
  { key: "pickup:tobias-sycamore", owner: "maeve", material: "leaves", gardener: "tobias", quantity: 4, collectedOn: "2026-11-10T17:40:00.000Z", review: { rating: 4, comment: "Damp but fine, easy side-gate pickup." } },
  { key: "pickup:priya-grounds", owner: "cafe", material: "coffee_grounds", gardener: "priya", quantity: 10, collectedOn: "2026-11-18T09:15:00.000Z", review: { rating: 5, comment: "Tub ready at the counter." } },
  { key: "pickup:maeve-park-leaves", owner: "council", material: "leaves", gardener: "maeve", quantity: 1, collectedOn: "2026-11-21T11:00:00.000Z" },
  { key: "pickup:ines-garden-leaves", owner: "supplier", material: "leaves", gardener: "gardener", quantity: 3, collectedOn: "2026-11-24T17:20:00.000Z", review: { rating: 5, comment: "Dry leaves in paper bags, as described." } },
];

function listingFor(p: PastPickup, all: DemoListing[]): DemoListing {
  const mine = all.filter((l) => l.owner === p.owner && l.material === p.material && l.price_cents === 0);
  const l = mine.at(-1);
  if (!l) throw new Error(`The demo has no free ${p.material} listing of ${p.owner}`);
  return l;
}

const hoursBefore = (iso: string, h: number) => new Date(new Date(iso).getTime() - h * 3_600_000).toISOString();

export async function seedPastPickups(trx: Knex.Transaction | Knex): Promise<void> {
  const all = demoListings();
  for (const p of PICKUPS) {
    const id = seedId(p.key);
    if (await trx("reservations").first("id").where({ id })) continue;
    const l = listingFor(p, all);
    const listingId = seedId(l.key);
    const gardenerId = seedId(`user:${p.gardener}`);
    const supplierId = seedId(`user:${l.owner}`);
    const requested = hoursBefore(p.collectedOn, 50);
    const confirmed = hoursBefore(p.collectedOn, 48);
    await trx("reservations").insert({
      id,
      listing_id: listingId,
      gardener_id: gardenerId,
      quantity: p.quantity,
      status: "collected",
      payment_state: "none",
      hold_expires_at: null,
      pickup_code: id.replace(/[^A-Z2-9]/gi, "").slice(0, 6).toUpperCase(),
      pickup_by: p.collectedOn,
      amount_cents: 0,
      deposit_cents: 0,
      currency: TOWN.currency,
      confirmed_at: confirmed,
      closed_at: p.collectedOn,
      created_at: requested,
      updated_at: p.collectedOn,
    });
    await trx("listings").where({ id: listingId }).increment("quantity_collected", p.quantity);
    await trx("reservation_events").insert([
      { reservation_id: id, from_status: null, to_status: "held", actor_id: gardenerId, note: null, created_at: requested },
      { reservation_id: id, from_status: "held", to_status: "confirmed", actor_id: l.auto_accept ? null : supplierId, note: null, created_at: confirmed },
      { reservation_id: id, from_status: "confirmed", to_status: "collected", actor_id: supplierId, note: null, created_at: p.collectedOn },
    ]);
    if (p.review) {
      await trx("reviews").insert({ id: seedId(`${p.key}:review`), reservation_id: id, author_id: gardenerId, subject_id: supplierId, rating: p.review.rating, comment: p.review.comment, created_at: p.collectedOn });
    }
  }
}
