import { WHOLE_UNITS } from "@/lib/calc/units";
import { writeTransaction } from "@/db/write-transaction";
import "server-only";
import { newId } from "@/db/index";
import { insertListing } from "@/db/listings";
import { insertPhotos } from "@/db/listing-photos";
import { replaceWindows } from "@/db/pickup-windows";
import { pickupWindowFields } from "@/lib/listings/windows";
import { recordAudit } from "@/db/audit";
import { ApiError } from "@/lib/api/errors";
import type { SessionUser } from "@/lib/auth/current-user";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import { checkUploadedPhotos } from "@/lib/media/verify-upload";
import { defaultUnitSize, type CreateListingInput } from "@/lib/validation/listings";
import { listingDates } from "@/lib/listings/dates";
import { alertIfDue } from "@/lib/services/needs/alert-if-due";
import { DUE_NOW } from "@/migrations/20261208_020_open_needs";
import { packOf, unitPriceOfPack } from "@/lib/listings/packs";
import { resolveContext, type Context } from "@/lib/context";

/** Posts a listing with its pickup windows and photos in one transaction: all of it or none. */
export async function createListing(user: SessionUser, input: CreateListingInput, ctx: Context = {}): Promise<{ id: string }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  // Selling live animals needs the grower role, which a moderator grants after a check.
  if (input.material === "worms" && !user.roles.includes("grower")) {
    throw new ApiError("forbidden", "Only worm growers can list live worms. Ask for the role on your profile.");
  }
  const dates = listingDates(input.available_from, input.available_until, now, input.status === "active");
  checkUploadedPhotos(user.id, input.photos);

  const id = newId();
  const approx = approximatePoint({ owner: placeOwner({ organisation_id: user.organisation?.id, owner_id: user.id }), ...input.location });
  const counted = WHOLE_UNITS.has(input.unit);
  // A pack listing's price per unit is what its pack works out at, whatever the client sent.
  const pack = packOf(input);
  await writeTransaction(q, async (trx) => {
    await insertListing(
      {
        id,
        owner_id: user.id,
        organisation_id: user.organisation?.id ?? null,
        material_code: input.material,
        title: input.title,
        description: input.description,
        status: input.status,
        unit: input.unit,
        unit_size: counted ? (input.unit_size ?? defaultUnitSize(input.unit, input.material)) : null,
        unit_mass_kg: input.unit === "bales" ? (input.unit_mass_kg ?? null) : null,
        quantity_total: input.quantity,
        quantity_held: 0,
        quantity_collected: 0,
        price_cents: pack ? unitPriceOfPack(pack) : input.price_cents,
        currency: input.currency,
        deposit_cents: input.deposit_cents,
        max_per_reservation: input.max_per_reservation ?? null,
        pack_size: pack?.size ?? null,
        pack_price_cents: pack?.price_cents ?? null,
        auto_accept: input.auto_accept,
        lat: input.location.lat,
        lng: input.location.lng,
        address: input.address,
        approx_lat: approx.lat,
        approx_lng: approx.lng,
        available_from: dates.from,
        available_until: dates.until,
        quality: input.quality,
        // Posted on offer: due to be checked against open needs straight away.
        needs_due_at: input.status === "active" ? DUE_NOW : null,
      },
      trx,
    );
    await replaceWindows(id, input.pickup_windows.map(pickupWindowFields), trx);
    await insertPhotos(id, input.photos, 0, trx);
    await recordAudit({ actor_id: user.id, action: "listing.create", subject_type: "listing", subject_id: id, after: { status: input.status, material: input.material } }, trx);
  });
  // Open needs it could serve are alerted now, so the supplier sees whom it reached; the
  // worker picks it up instead if this fails.
  await alertIfDue(id, { db: q, clock });
  return { id };
}
