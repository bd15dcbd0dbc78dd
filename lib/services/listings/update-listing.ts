import { WHOLE_UNITS } from "@/lib/calc/units";
import { writeTransaction } from "@/db/write-transaction";
import "server-only";
import { z } from "zod";
import { findManagedListing, setQuantityTotal, updateManagedListing, type ListingPatch } from "@/db/listings";
import { replaceWindows } from "@/db/pickup-windows";
import { pickupWindowFields } from "@/lib/listings/windows";
import { recordAudit } from "@/db/audit";
import { ApiError, fromZod, notFound } from "@/lib/api/errors";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import { listingDates } from "@/lib/listings/dates";
import { alertIfDue } from "@/lib/services/needs/alert-if-due";
import { packOf, unitPriceOfPack } from "@/lib/listings/packs";
import { resolveContext, type Context } from "@/lib/context";
import { checkListingRules, type LISTING_CURRENCIES, defaultUnitSize, listingFieldsSchema, type UpdateListingInput } from "@/lib/validation/listings";

// The same rules as a new listing, checked on the listing as it would be after the change.
const mergedSchema = listingFieldsSchema.superRefine(checkListingRules);

/** Edits a listing its owner (or their organisation) manages; anyone else gets 404. */
export async function updateListing(userId: string, id: string, patch: UpdateListingInput, ctx: Context = {}): Promise<void> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  await writeTransaction(q, async (trx) => {
    const row = await findManagedListing(id, userId, trx);
    if (!row) throw notFound("That listing");
    if (row.status === "hidden") throw new ApiError("invalid_state", "A moderator has hidden this listing; it cannot be edited until they restore it.");
    if (row.status === "archived") throw new ApiError("invalid_state", "Archived listings cannot be edited. Post a new one instead.");

    const unitChanges = patch.unit !== undefined && patch.unit !== row.unit;
    if (unitChanges && row.quantity_held + row.quantity_collected > 0) {
      throw new ApiError("invalid_state", "The unit cannot change while some of it is reserved or collected.", { unit: "Reserved or collected amounts are counted in the current unit." });
    }
    const merged = mergedSchema.safeParse({
      material: row.material_code,
      title: patch.title ?? row.title,
      description: patch.description ?? row.description,
      unit: patch.unit ?? row.unit,
      // A new unit starts from its own size, not the old unit's.
      unit_size: patch.unit_size !== undefined ? patch.unit_size : unitChanges ? null : row.unit_size,
      unit_mass_kg: patch.unit_mass_kg !== undefined ? patch.unit_mass_kg : unitChanges ? null : row.unit_mass_kg,
      quantity: patch.quantity ?? row.quantity_total,
      price_cents: patch.price_cents ?? row.price_cents,
      currency: (patch.currency ?? row.currency) as (typeof LISTING_CURRENCIES)[number],
      deposit_cents: patch.deposit_cents ?? row.deposit_cents,
      max_per_reservation: patch.max_per_reservation !== undefined ? patch.max_per_reservation : row.max_per_reservation,
      pack_size: patch.pack_size !== undefined ? patch.pack_size : row.pack_size,
      pack_price_cents: patch.pack_price_cents !== undefined ? patch.pack_price_cents : row.pack_price_cents,
      auto_accept: patch.auto_accept ?? Boolean(row.auto_accept),
      location: patch.location ?? { lat: row.lat, lng: row.lng },
      address: patch.address ?? row.address,
      available_from: patch.available_from !== undefined ? patch.available_from : row.available_from,
      available_until: patch.available_until !== undefined ? patch.available_until : row.available_until,
      quality: patch.quality ?? row.quality,
      pickup_windows: patch.pickup_windows ?? [],
    } satisfies z.input<typeof mergedSchema>);
    if (!merged.success) throw fromZod(merged.error);
    const l = merged.data;

    const changes: ListingPatch = {};
    if (patch.title !== undefined) changes.title = l.title;
    if (patch.description !== undefined) changes.description = l.description;
    if (patch.unit !== undefined || patch.unit_size !== undefined || patch.unit_mass_kg !== undefined) {
      const counted = WHOLE_UNITS.has(l.unit);
      changes.unit = l.unit;
      changes.unit_size = counted ? (l.unit_size ?? defaultUnitSize(l.unit, l.material)) : null;
      changes.unit_mass_kg = l.unit === "bales" ? (l.unit_mass_kg ?? null) : null;
    }
    const pack = packOf(l);
    if (patch.pack_size !== undefined || patch.pack_price_cents !== undefined) {
      changes.pack_size = pack?.size ?? null;
      changes.pack_price_cents = pack?.price_cents ?? null;
    }
    // A pack listing's price per unit is always what its pack works out at.
    if (pack) changes.price_cents = unitPriceOfPack(pack);
    else if (patch.price_cents !== undefined) changes.price_cents = l.price_cents;
    if (patch.currency !== undefined) changes.currency = l.currency;
    if (patch.deposit_cents !== undefined) changes.deposit_cents = l.deposit_cents;
    if (patch.max_per_reservation !== undefined) changes.max_per_reservation = l.max_per_reservation ?? null;
    if (patch.auto_accept !== undefined) changes.auto_accept = l.auto_accept;
    if (patch.location !== undefined) {
      const approx = approximatePoint({ owner: placeOwner(row), lat: l.location.lat, lng: l.location.lng });
      Object.assign(changes, { lat: l.location.lat, lng: l.location.lng, approx_lat: approx.lat, approx_lng: approx.lng });
    }
    if (patch.address !== undefined) changes.address = l.address;
    if (patch.available_from !== undefined || patch.available_until !== undefined) {
      const dates = listingDates(l.available_from, l.available_until, now, patch.available_until !== undefined && row.status !== "draft");
      changes.available_from = dates.from;
      changes.available_until = dates.until;
    }
    if (patch.quality !== undefined) changes.quality = l.quality;

    await updateManagedListing(id, userId, changes, trx);
    if (patch.quantity !== undefined && patch.quantity !== row.quantity_total && !(await setQuantityTotal(id, l.quantity, trx))) {
      const committed = row.quantity_held + row.quantity_collected;
      throw new ApiError("invalid_input", "Some fields need another look.", {
        quantity: `${committed} ${row.unit} is already reserved or collected, so the total cannot go below that.`,
      });
    }
    if (patch.pickup_windows !== undefined) await replaceWindows(id, l.pickup_windows.map(pickupWindowFields), trx);
    await recordAudit({ actor_id: userId, action: "listing.update", subject_type: "listing", subject_id: id, after: Object.keys(patch) }, trx);
  });
  // More of it, new dates or a new place: open needs it can now serve hear of it.
  await alertIfDue(id, { db: q, clock });
}
