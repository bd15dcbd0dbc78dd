import type { ListingUnit } from "@/lib/calc/units";
import "server-only";
// What the world sees of a listing. Every public shape is built here and nowhere else, from
// the approximate point only; the exact point and address are added in one place, for the
// people who manage the listing, so a page or route cannot leak them by accident.
import type { Db } from "@/db/index";
import { db } from "@/db/index";
import { organisationNames, suppliersOf } from "@/db/listings";
import { photosFor } from "@/db/listing-photos";
import { windowsFor } from "@/db/pickup-windows";
import { matchedGardeners } from "@/db/need-alerts";
import { collectionsFor, ratingsFor } from "@/db/reviews";
import type { ListingPhotoRow, ListingRow, ListingStatus, PickupWindowRow } from "@/db/types";
import type { PublicListingRow } from "@/db/listing-search";
import { listingCautions, type ListingCaution } from "@/lib/calc/cautions";
import type { MaterialCode } from "@/lib/calc/facts";
import { photoUrl, type PhotoSize, type PhotoVariant } from "@/lib/media/photo-urls";
import type { QualityInput } from "@/lib/validation/listings";
import { datesState, effectiveStatus, quantityLeft } from "./status";
import { packOf, type Pack } from "./packs";

export interface PublicListingItem {
  id: string;
  material: MaterialCode;
  title: string;
  quantity_available: number;
  unit: ListingUnit;
  /** m² a sheet, m³ a bag or bale; null for m², m³ and kg. */
  unit_size: number | null;
  unit_mass_kg: number | null;
  /** Per listing unit; for a pack listing, what its pack works out at. */
  price_cents: number;
  currency: string;
  deposit_cents: number;
  /** Sold by the pack (live cultures): reservations are whole packs at price_cents a pack; null when priced per unit. */
  pack: Pack | null;
  distance_km: number | null;
  /** The approximate public point, a stable few hundred metres from the real one. */
  location: { lat: number; lng: number };
  /**
   * `rating`: what gardeners said of this supplier after collecting (null before any review);
   * `collections`: how many reservations of theirs were collected.
   */
  supplier: { id: string; name: string; verified: boolean; rating: { average: number; count: number } | null; collections: number };
  photos: PhotoVariant[];
  available_until: string | null;
  /** Listed ahead of its start date: shown, but reservable only from this moment (null once it is). */
  reservable_from: string | null;
}

export type PickupWindowView = Omit<PickupWindowRow, "listing_id">;

export interface ListingDetail extends PublicListingItem {
  status: ListingStatus;
  description: string;
  available_from: string | null;
  max_per_reservation: number | null;
  auto_accept: boolean;
  quality: QualityInput;
  cautions: ListingCaution[];
  pickup_windows: PickupWindowView[];
  thumbnails: PhotoVariant[];
  created_at: string;
  updated_at: string;
}

/** The detail as its owner (or a member of its organisation) sees it. */
export interface ManagedListingDetail extends ListingDetail {
  can_manage: true;
  pickup: { address: string; location: { lat: number; lng: number } };
  quantity_total: number;
  quantity_held: number;
  quantity_collected: number;
  /** How many different gardeners' open needs it has been matched to (alerts sent); no one is named. */
  matched_gardeners: number;
  photo_records: { id: string; public_id: string; width: number; height: number; format: string; url: string }[];
}

type Row = Pick<
  ListingRow,
  | "id" | "owner_id" | "organisation_id" | "material_code" | "title" | "unit" | "unit_size" | "unit_mass_kg"
  | "quantity_total" | "quantity_held" | "quantity_collected" | "price_cents" | "currency" | "deposit_cents"
  | "pack_size" | "pack_price_cents" | "approx_lat" | "approx_lng" | "available_until" | "available_from"
>;

const photoList = (rows: ListingPhotoRow[] | undefined, size: PhotoSize) => (rows ?? []).map((p) => photoUrl(p, size));

async function suppliersFor(rows: Row[], q: Db) {
  const [people, orgs] = await Promise.all([
    suppliersOf(rows.map((r) => r.owner_id), q),
    organisationNames(rows.map((r) => r.organisation_id ?? ""), q),
  ]);
  return (r: Row) => {
    const person = people.get(r.owner_id) ?? { id: r.owner_id, name: "A Duffbank member", verified: false };
    // A council's listings are the council's, whichever staff member typed them in.
    return { ...person, name: (r.organisation_id && orgs.get(r.organisation_id)) || person.name };
  };
}

function item(r: Row, supplier: PublicListingItem["supplier"], photos: PhotoVariant[], distanceKm: number | null, now: Date): PublicListingItem {
  return {
    id: r.id,
    material: r.material_code,
    title: r.title,
    quantity_available: quantityLeft(r),
    unit: r.unit,
    unit_size: r.unit_size,
    unit_mass_kg: r.unit_mass_kg,
    price_cents: r.price_cents,
    currency: r.currency,
    deposit_cents: r.deposit_cents,
    pack: packOf(r),
    // Shown to 10 m: finer would only suggest a precision the approximate point does not have.
    distance_km: distanceKm === null ? null : Math.round(distanceKm * 100) / 100,
    location: { lat: r.approx_lat, lng: r.approx_lng },
    supplier,
    photos,
    available_until: r.available_until,
    reservable_from: datesState(r, now) === "not_yet" ? r.available_from : null,
  };
}

/** Browse results as the API and the browse page return them. */
export async function presentItems(rows: PublicListingRow[], q: Db = db(), now: Date = new Date()): Promise<PublicListingItem[]> {
  const owners = rows.map((r) => r.owner_id);
  const [supplierOf, photos, ratings, collections] = await Promise.all([suppliersFor(rows, q), photosFor(rows.map((r) => r.id), q), ratingsFor(owners, q), collectionsFor(owners, q)]);
  return rows.map((r) =>
    item(r, { ...supplierOf(r), rating: ratings.get(r.owner_id) ?? null, collections: collections.get(r.owner_id) ?? 0 }, photoList(photos.get(r.id), "card"), r.distance_km, now),
  );
}

const windowView = ({ listing_id: _listing, ...w }: PickupWindowRow): PickupWindowView => w;

export async function presentDetail(r: ListingRow, opts: { manage: boolean; now?: Date }, q: Db = db()): Promise<ListingDetail | ManagedListingDetail> {
  const [supplierOf, photos, windows, ratings, collections] = await Promise.all([
    suppliersFor([r], q),
    photosFor([r.id], q),
    windowsFor([r.id], q),
    ratingsFor([r.owner_id], q),
    collectionsFor([r.owner_id], q),
  ]);
  const quality = r.quality as QualityInput;
  const photoRows = photos.get(r.id) ?? [];
  const detail: ListingDetail = {
    ...item(r, { ...supplierOf(r), rating: ratings.get(r.owner_id) ?? null, collections: collections.get(r.owner_id) ?? 0 }, photoList(photoRows, "large"), null, opts.now ?? new Date()),
    status: effectiveStatus(r.status, r.available_until, opts.now),
    description: r.description,
    available_from: r.available_from,
    max_per_reservation: r.max_per_reservation,
    auto_accept: Boolean(r.auto_accept),
    quality,
    cautions: listingCautions({ material: r.material_code, unit: r.unit, unit_mass_kg: r.unit_mass_kg, quality }),
    pickup_windows: (windows.get(r.id) ?? []).map(windowView),
    thumbnails: photoList(photoRows, "thumb"),
    created_at: r.created_at,
    updated_at: r.updated_at,
  };
  if (!opts.manage) return detail;
  const matched = await matchedGardeners(r.id, q);
  return {
    ...detail,
    can_manage: true,
    pickup: { address: r.address, location: { lat: r.lat, lng: r.lng } },
    quantity_total: r.quantity_total,
    quantity_held: r.quantity_held,
    quantity_collected: r.quantity_collected,
    matched_gardeners: matched,
    photo_records: photoRows.map((p) => ({ id: p.id, public_id: p.public_id, width: p.width, height: p.height, format: p.format, url: photoUrl(p, "thumb").url })),
  };
}
