import { WHOLE_UNITS } from "@/lib/calc/units";
import "server-only";
import type { Knex } from "knex";
import { writeTransaction } from "@/db/write-transaction";
import { newId } from "@/db/index";
import { insertPayment } from "@/db/payments";
import { reservationContext } from "@/db/reservation-context";
import { availableOf, holdQuantity, insertReservation, listingsForReservation, pickupWindowsOf, recordReservationEvent, type ListingForReservation } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { ApiError, type FieldErrors } from "@/lib/api/errors";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { openCheckouts } from "@/lib/payments/checkout";
import { MIN_CARD_CHARGE_CENTS, depositFor, listingPrice } from "@/lib/payments/money";
import { quantityLabel, quantityLimitProblem, reservableQuantity } from "@/lib/reservations/labels";
import { earliestPickupStart, holdFor, holdWaitFor } from "@/lib/reservations/policy";
import { datesState } from "@/lib/listings/status";
import { formatDay } from "@/lib/listings/format";
import { nextOccurrence } from "@/lib/reservations/pickup-times";
import { cultureOptions, defaultFulfilment, type Fulfilment } from "@/lib/reservations/culture-orders";
import { findShipping } from "@/db/grower-shipping";
import { packOf, wholePackProblem } from "@/lib/listings/packs";
import { confirmReservation, pickupTimes } from "@/lib/services/reservations/steps/reservation-steps";
import { shippingView } from "@/lib/growers/view";
import { formatMoney } from "@/lib/format/money";
import { resolveContext, type Context } from "@/lib/context";

// POST /api/reservations: hold quantities of one or more listings for a gardener, all or
// nothing in one transaction, then open a Stripe checkout for whatever needs paying.

export interface ReserveItem {
  listing_id: string;
  quantity: number;
  pickup_window_id?: string | null;
  /** Live cultures: collected or posted; other material is always collected. */
  fulfilment?: Fulfilment | null;
  ship_to?: string | null;
}

export interface ReserveInput {
  gardenerId: string;
  items: ReserveItem[];
  bed_id?: string | null;
  /** An open need of the gardener's (reserving from an alert): counted for the items of its material. */
  need_id?: string | null;
  /** Field names in errors: "quantity" for a single reservation, "items.2.quantity" for a list. */
  fieldPrefix: (index: number) => string;
}

type Checked = {
  item: ReserveItem;
  need_id: string | null;
  listing: ListingForReservation;
  amount: number;
  deposit: number;
  window: Awaited<ReturnType<typeof pickupWindowsOf>>[number] | null;
  /** The earliest the pickup may start: the supplier must have time to answer first. */
  notBefore: Date | null;
  fulfilment: Fulfilment | null;
};

/** What is left to reserve: whole pieces of sheets, bags and bales, whole packs of a pack listing. */
const leftOf = (l: ListingForReservation) => reservableQuantity(availableOf(l), l.unit, packOf(l));

/**
 * How a live culture reaches this buyer: what the grower offers, and posting only while the
 * grower has not paused it for heat or frost. Null for material that is not a live culture.
 */
async function fulfilmentFor(item: ReserveItem, listing: ListingForReservation, f: string, fields: FieldErrors, q: Knex): Promise<Fulfilment | null> {
  if (listing.material_code !== "worms") {
    if (item.fulfilment === "post") fields[`${f}fulfilment`] = "Only live cultures are posted; this is collected.";
    return null;
  }
  const offer = cultureOptions(listing.quality);
  const chosen = item.fulfilment ?? defaultFulfilment(offer);
  if (chosen === "pickup" && !offer.pickup) fields[`${f}fulfilment`] = "This culture is posted only; choose post and give an address.";
  if (chosen === "post") {
    const shipping = shippingView(await findShipping(listing.owner_id, q));
    if (!offer.ships) fields[`${f}fulfilment`] = "This culture is for collection only.";
    else if (shipping.paused) fields[`${f}fulfilment`] = `${shipping.notice} Choose collection, or order once posting resumes.`;
    if (!item.ship_to) fields[`${f}ship_to`] = f ? "A posted culture needs an address: give the postal address it goes to, with the postcode." : "Give the full postal address the parcel goes to, with the postcode.";
    if (item.pickup_window_id) fields[`${f}pickup_window_id`] = "A posted order has no pickup window.";
  }
  return chosen;
}

async function check(input: ReserveInput, q: Knex, now: Date): Promise<Checked[]> {
  const ids = input.items.map((i) => i.listing_id);
  const listings = new Map((await listingsForReservation(ids, q)).map((l) => [l.id, l]));
  const windows = await pickupWindowsOf(ids, q);
  const myOrgs = new Set<string>(await q("memberships").where({ user_id: input.gardenerId }).pluck("organisation_id"));
  const fields: FieldErrors = {};
  const seen = new Set<string>();
  const out: Checked[] = [];
  // In a list ("Reserve all"), a stop that cannot be reserved at all is named on its own
  // listing_id and the others are still checked, so each stop shows its own problem.
  const many = input.fieldPrefix(0) !== "";
  const refusals: ApiError[] = [];
  for (const [i, item] of input.items.entries()) {
    const f = input.fieldPrefix(i);
    try {
      out.push(await checkItem(item, f));
    } catch (err) {
      if (!many || !(err instanceof ApiError)) throw err;
      fields[`${f}listing_id`] = err.message;
      refusals.push(err);
    }
  }
  if (input.bed_id) {
    const bed = await q("beds").first("id").where({ id: input.bed_id, owner_id: input.gardenerId });
    if (!bed) fields.bed_id = "Choose one of your own beds.";
  }
  if (input.need_id) {
    const need = await q("needs").first("material_code").where({ id: input.need_id, owner_id: input.gardenerId });
    const serving = need ? out.filter((c) => c.listing.material_code === need.material_code) : [];
    if (!need) fields.need_id = "Choose one of your own needs.";
    else if (!serving.length) fields.need_id = "That need is for another material.";
    for (const c of serving) c.need_id = input.need_id;
  }
  if (Object.keys(fields).length) {
    // A refusal keeps its own status (404 for a listing nobody may see, 409 for one not
    // taking reservations); its message stands alone when it is the only problem.
    const only = refusals.length === 1 && Object.keys(fields).length === 1 ? refusals[0].message : null;
    throw new ApiError(refusals[0]?.code ?? "invalid_input", only ?? "Some of the reservation needs another look.", fields);
  }
  return out;

  async function checkItem(item: ReserveItem, f: string): Promise<Checked> {
    const listing = listings.get(item.listing_id);
    if (!listing || listing.status === "draft" || listing.status === "hidden") throw new ApiError("not_found", "That listing was not found.");
    if (listing.owner_id === input.gardenerId || (listing.organisation_id && myOrgs.has(listing.organisation_id))) {
      throw new ApiError("conflict", "This is your own listing (or your organisation's): there is nothing to reserve.");
    }
    // The dates bind before the worker has caught up with them (it marks a listing expired
    // only every minute), and a listing shown ahead of its start is not reservable yet.
    const dates = datesState(listing, now);
    if (dates === "ended") throw new ApiError("invalid_state", `“${listing.title}” ended on ${formatDay(listing.available_until)}; it is not taking reservations any more.`);
    if (dates === "not_yet") throw new ApiError("invalid_state", `“${listing.title}” can be reserved from ${formatDay(listing.available_from)}.`);
    if (seen.has(listing.id)) fields[`${f}listing_id`] = "This listing is in the list twice; reserve it once with the total.";
    seen.add(listing.id);
    const pack = packOf(listing);
    const packProblem = pack ? wholePackProblem(item.quantity, pack, listing.unit) : null;
    if (WHOLE_UNITS.has(listing.unit) && !Number.isInteger(item.quantity)) {
      fields[`${f}quantity`] = `Reserve whole ${listing.unit}.`;
    } else if (packProblem) {
      fields[`${f}quantity`] = packProblem;
    } else if (!pack && Math.abs(item.quantity * 100 - Math.round(item.quantity * 100)) > 1e-6) {
      fields[`${f}quantity`] = "Use at most two decimals.";
    } else if (listing.max_per_reservation !== null && item.quantity > listing.max_per_reservation + 1e-9 && listing.max_per_reservation < leftOf(listing)) {
      // Only when the cap is the tighter limit: past what is left, the hold below answers 409.
      fields[`${f}quantity`] = quantityLimitProblem(item.quantity, { available: leftOf(listing), max_per_reservation: listing.max_per_reservation, unit: listing.unit })!;
    }
    // A pack listing costs whole packs at the pack price, not its rounded price per kg.
    const amount = listingPrice({ price_cents: listing.price_cents, pack }, item.quantity);
    const deposit = depositFor(listing.price_cents, listing.deposit_cents);
    const charge = amount || deposit;
    const min = MIN_CARD_CHARGE_CENTS[listing.currency];
    if (charge > 0 && min && charge < min && !fields[`${f}quantity`]) {
      fields[`${f}quantity`] = `Card payments start at ${formatMoney(min, listing.currency)}; reserve a little more.`;
    }
    // A request the supplier must answer is never made for a pickup that starts before they could.
    const notBefore = earliestPickupStart(now, { owes: charge > 0, autoAccept: Boolean(listing.auto_accept) });
    let window = null;
    if (item.pickup_window_id) {
      window = windows.find((w) => w.id === item.pickup_window_id && w.listing_id === listing.id) ?? null;
      if (!window) fields[`${f}pickup_window_id`] = "Choose one of this listing's pickup windows.";
      else if (!nextOccurrence(window, now)) fields[`${f}pickup_window_id`] = "That pickup window is over; choose another.";
      else if (!nextOccurrence(window, now, undefined, notBefore)) {
        fields[`${f}pickup_window_id`] = "That pickup window starts too soon for the supplier to answer first; choose a later one.";
      }
    }
    const fulfilment = await fulfilmentFor(item, listing, f, fields, q);
    return { item, listing, amount, deposit, window, notBefore, fulfilment, need_id: null };
  }
}

export async function reserveListings(input: ReserveInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const checked = await check(input, q, now);
  const groupId = input.items.length > 1 ? newId() : null;
  const at = now.toISOString();

  const created = await writeTransaction(q, async (trx) => {
    const rows: { id: string; paymentId: string | null }[] = [];
    for (const c of checked) {
      // The first statement of the transaction is this write, so SQLite takes its write lock
      // here and parallel requests queue for it instead of failing on a stale snapshot.
      if (!(await holdQuantity(c.listing.id, c.item.quantity, trx))) {
        const fresh = (await listingsForReservation([c.listing.id], trx))[0];
        // "gone" is what the listings' trigger calls an active listing with nothing left.
        if (fresh.status !== "active" && fresh.status !== "gone") throw new ApiError("invalid_state", `“${fresh.title}” is not taking reservations right now.`);
        const left = leftOf(fresh);
        const message = left > 0 ? `Only ${quantityLabel(left, fresh.unit)} of “${fresh.title}” is left.` : `Nothing of “${fresh.title}” is left.`;
        // Named on the item's quantity too, so a form (or a plan's stop) shows it where it belongs.
        throw new ApiError("insufficient_quantity", message, { [`${input.fieldPrefix(checked.indexOf(c))}quantity`]: message });
      }
      const owes = c.amount > 0 || c.deposit > 0;
      const times = pickupTimes(c.window, now, c.notBefore);
      // A checkout keeps the short hold; a request waits for the supplier's answer until
      // before the pickup starts; an auto-accept listing is confirmed below at once.
      const hold = holdFor(holdWaitFor({ owes, autoAccept: Boolean(c.listing.auto_accept) }) ?? "checkout", now, times.pickup_at ?? times.pickup_by);
      const row: ReservationRow = {
        id: newId(),
        listing_id: c.listing.id,
        gardener_id: input.gardenerId,
        bed_id: input.bed_id ?? null,
        need_id: c.need_id,
        pickup_window_id: c.window?.id ?? null,
        group_id: groupId,
        quantity: c.item.quantity,
        status: "held",
        payment_state: owes ? "awaiting" : "none",
        ...hold,
        pickup_code: null,
        ...times,
        amount_cents: c.amount,
        deposit_cents: c.deposit,
        currency: c.listing.currency,
        confirmed_at: null,
        closed_at: null,
        cancelled_by: null,
        expiry_warned_at: null,
        pickup_reminded_at: null,
        fulfilment: c.fulfilment,
        ship_to: c.fulfilment === "post" ? (c.item.ship_to ?? null) : null,
        order_stage: null,
        carrier: null,
        tracking: null,
        shipped_at: null,
        created_at: at,
        updated_at: at,
      };
      await insertReservation(row, trx);
      await recordReservationEvent({ reservation_id: row.id, from_status: null, to_status: "held", actor_id: input.gardenerId, note: null, created_at: at }, trx);
      let paymentId: string | null = null;
      if (owes) {
        const kind = c.amount > 0 ? "payment" : "deposit";
        const p = await insertPayment(
          { reservation_id: row.id, kind, status: "creating", amount_cents: c.amount || c.deposit, currency: row.currency, idempotency_key: `checkout:${row.id}` },
          at,
          trx,
        );
        paymentId = p.id;
      } else if (c.listing.auto_accept) {
        await confirmReservation(trx, row, null, now, "The listing accepts automatically");
      } else {
        await mailReservation(trx, "requested", (await reservationContext(row.id, trx))!, ["supplier", "gardener"]);
      }
      rows.push({ id: row.id, paymentId });
    }
    return rows;
  });

  // Stripe is called only after the hold is committed, for a few seconds at most: a slow or
  // failing Stripe never keeps the database locked, and a checkout it could not make is left
  // to the worker, which makes it and e-mails the gardener; the page can also try again.
  const owed = created.filter((r): r is { id: string; paymentId: string } => !!r.paymentId);
  const opened = await openCheckouts(owed.map((r) => r.paymentId), clock, q);
  const checkoutUrls = new Map(owed.map((r) => [r.id, opened.get(r.paymentId) ?? null]));
  const checkoutUrl = [...checkoutUrls.values()].find((url) => url) ?? null;
  return { ids: created.map((r) => r.id), checkoutUrl, checkoutUrls };
}
