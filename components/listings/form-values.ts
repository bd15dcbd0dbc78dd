// The listing form holds what a person types, in their own units (cubic yards, pounds, US
// gallons for imperial readers; euros rather than cents); the API takes SI and cents. These
// two functions are the only crossing, and the form's resolver runs the shared schema on
// the converted body, so form and route check exactly the same rules.
import type { MaterialCode } from "@/lib/calc/facts";
import { LITRE_M3 } from "@/lib/calc/facts";
import { ft2ToM2, kgToLb, lbToKg, lToUsGal, m2ToFt2, m3ToFt3, m3ToYd3, usGalToL, yd3ToM3, type UnitSystem, WHOLE_UNITS, type ListingUnit } from "@/lib/calc/units";
import { FOOT_M } from "@/lib/calc/facts";
import { defaultUnitSize, HERBICIDE_MATERIALS, type UploadedPhoto } from "@/lib/validation/listings";

export interface WindowValues {
  kind: "weekly" | "dated";
  weekday: string;
  start_time: string;
  end_time: string;
  /** datetime-local text: wall-clock time at the pickup place. */
  starts_at: string;
  ends_at: string;
}

export interface ListingFormState {
  status: "active" | "draft";
  material: MaterialCode;
  title: string;
  description: string;
  unit: ListingUnit;
  quantity: string;
  unit_size: string;
  unit_mass_kg: string;
  /** "per_pack": a live culture sold in packs of a set weight at a price a pack. */
  priced: "free" | "priced" | "per_pack";
  price_cents: string;
  /** In the reader's mass unit (kg or lb). */
  pack_size: string;
  pack_price_cents: string;
  currency: "eur" | "gbp" | "usd";
  deposit_cents: string;
  max_per_reservation: string;
  auto_accept: boolean;
  location: { lat: number | null; lng: number | null };
  address: string;
  available_from: string;
  available_until: string;
  quality: { tape_removed: boolean; no_glossy_print: boolean; herbicide_history: string; leaf_source: string; species: string; ships: boolean; pickup: boolean };
  pickup_windows: WindowValues[];
  photos: UploadedPhoto[];
}

/** The symbol a quantity or size field is typed in. */
export function quantitySymbol(unit: ListingUnit, system: UnitSystem): string {
  if (unit === "m3") return system === "imperial" ? "yd³" : "m³";
  if (unit === "m2") return system === "imperial" ? "ft²" : "m²";
  if (unit === "kg") return system === "imperial" ? "lb" : "kg";
  return unit;
}

export function unitSizeField(unit: ListingUnit, system: UnitSystem): { label: string; symbol: string } | null {
  const imperial = system === "imperial";
  if (unit === "bags") return { label: "Size of one bag", symbol: imperial ? "US gal" : "L" };
  if (unit === "sheets") return { label: "Area of one sheet", symbol: imperial ? "ft²" : "m²" };
  if (unit === "bales") return { label: "Size of one bale", symbol: imperial ? "ft³" : "m³" };
  return null;
}

const FT3_M3 = FOOT_M ** 3;
const round = (x: number, places = 3) => Number(x.toFixed(places));
const numberOrNull = (s: string) => (s.trim() === "" ? null : Number(s.replace(",", ".")));

function quantityToSi(x: number, unit: ListingUnit, system: UnitSystem): number {
  if (system === "metric") return x;
  if (unit === "m3") return yd3ToM3(x);
  if (unit === "m2") return ft2ToM2(x);
  if (unit === "kg") return lbToKg(x);
  return x;
}

function quantityFromSi(x: number, unit: ListingUnit, system: UnitSystem): number {
  if (system === "metric") return x;
  if (unit === "m3") return m3ToYd3(x);
  if (unit === "m2") return m2ToFt2(x);
  if (unit === "kg") return kgToLb(x);
  return x;
}

function unitSizeToSi(x: number, unit: ListingUnit, system: UnitSystem): number {
  const imperial = system === "imperial";
  if (unit === "bags") return (imperial ? usGalToL(x) : x) * LITRE_M3;
  if (unit === "sheets") return imperial ? ft2ToM2(x) : x;
  return imperial ? x * FT3_M3 : x; // bales
}

function unitSizeFromSi(m: number, unit: ListingUnit, system: UnitSystem): number {
  const imperial = system === "imperial";
  if (unit === "bags") return imperial ? lToUsGal(m / LITRE_M3) : m / LITRE_M3;
  if (unit === "sheets") return imperial ? m2ToFt2(m) : m;
  return imperial ? m3ToFt3(m) : m;
}

const moneyToCents = (s: string) => (s.trim() === "" ? 0 : Math.round(Number(s.replace(",", ".")) * 100));
const centsToMoney = (c: number) => (c === 0 ? "" : (c / 100).toFixed(2));
const toWallClock = (local: string) => (local ? `${local.length === 16 ? `${local}:00` : local}Z` : "");
const fromWallClock = (iso: string | null) => (iso ? iso.slice(0, 16) : "");

/** Only the declarations that belong to the material go to the server. */
function qualityBody(material: MaterialCode, q: ListingFormState["quality"]) {
  if (material === "cardboard") return { tape_removed: q.tape_removed, no_glossy_print: q.no_glossy_print };
  if (material === "leaves") return q.leaf_source ? { leaf_source: q.leaf_source } : {};
  if (material === "worms") return { ...(q.species.trim() ? { species: q.species.trim() } : {}), ships: q.ships, pickup: q.pickup };
  if (HERBICIDE_MATERIALS.includes(material)) return q.herbicide_history ? { herbicide_history: q.herbicide_history } : {};
  return {};
}

/** Form state → the API body (SI units, cents). Numbers that do not parse become NaN for the schema to name. */
export function toBody(v: ListingFormState, system: UnitSystem) {
  const counted = WHOLE_UNITS.has(v.unit);
  const size = numberOrNull(v.unit_size);
  const mass = numberOrNull(v.unit_mass_kg);
  const max = numberOrNull(v.max_per_reservation);
  const qty = numberOrNull(v.quantity);
  const packSize = numberOrNull(v.pack_size);
  const perPack = v.priced === "per_pack" && v.material === "worms";
  return {
    status: v.status,
    material: v.material,
    title: v.title,
    description: v.description,
    unit: v.unit,
    quantity: qty === null ? undefined : round(quantityToSi(qty, v.unit, system), 6),
    unit_size: counted && size !== null ? round(unitSizeToSi(size, v.unit, system), 6) : null,
    unit_mass_kg: v.unit === "bales" && mass !== null ? round(system === "imperial" ? lbToKg(mass) : mass, 3) : null,
    // A pack listing's price per kg is worked out by the server from its pack.
    price_cents: v.priced === "priced" ? moneyToCents(v.price_cents) : 0,
    // To the gram, so a pack typed in pounds stores as the grower would weigh it.
    // Left empty: NaN, so the schema asks for it rather than posting a culture free by mistake.
    pack_size: perPack ? (packSize === null ? NaN : round(quantityToSi(packSize, v.unit, system), 3)) : null,
    pack_price_cents: perPack ? (v.pack_price_cents.trim() === "" ? NaN : moneyToCents(v.pack_price_cents)) : null,
    currency: v.currency,
    deposit_cents: moneyToCents(v.deposit_cents),
    max_per_reservation: max === null ? null : round(quantityToSi(max, v.unit, system), 6),
    auto_accept: v.auto_accept,
    location: v.location.lat === null || v.location.lng === null ? undefined : { lat: v.location.lat, lng: v.location.lng },
    address: v.address,
    available_from: v.available_from || null,
    available_until: v.available_until || null,
    quality: qualityBody(v.material, v.quality),
    pickup_windows: v.pickup_windows.map((w) =>
      w.kind === "weekly"
        ? { kind: "weekly" as const, weekday: Number(w.weekday), start_time: w.start_time, end_time: w.end_time }
        : { kind: "dated" as const, starts_at: toWallClock(w.starts_at), ends_at: toWallClock(w.ends_at) },
    ),
    photos: v.photos,
  };
}

export function emptyForm(material: MaterialCode = "leaves"): ListingFormState {
  return {
    status: "active",
    material,
    title: "",
    description: "",
    unit: "bags",
    quantity: "",
    unit_size: "",
    unit_mass_kg: "",
    priced: "free",
    price_cents: "",
    pack_size: "",
    pack_price_cents: "",
    currency: "eur",
    deposit_cents: "",
    max_per_reservation: "",
    auto_accept: false,
    location: { lat: null, lng: null },
    address: "",
    available_from: "",
    available_until: "",
    quality: { tape_removed: true, no_glossy_print: true, herbicide_history: "", leaf_source: "", species: "", ships: true, pickup: true },
    pickup_windows: [{ kind: "weekly", weekday: "6", start_time: "09:00", end_time: "12:00", starts_at: "", ends_at: "" }],
    photos: [],
  };
}

/** What the supplier sees in the size field when they have not typed one. */
export function unitSizePlaceholder(unit: ListingUnit, system: UnitSystem, material?: MaterialCode): string {
  const d = defaultUnitSize(unit, material);
  return d === null ? "" : String(round(unitSizeFromSi(d, unit, system), 2));
}

export interface StoredListingValues {
  material: MaterialCode;
  title: string;
  description: string;
  unit: ListingUnit;
  unit_size: number | null;
  unit_mass_kg: number | null;
  quantity_total: number;
  price_cents: number;
  pack?: { size: number; price_cents: number } | null;
  currency: string;
  deposit_cents: number;
  max_per_reservation: number | null;
  auto_accept: boolean;
  pickup: { address: string; location: { lat: number; lng: number } };
  available_from: string | null;
  available_until: string | null;
  quality: Partial<Record<"tape_removed" | "no_glossy_print" | "herbicide_history" | "leaf_source" | "species" | "ships" | "pickup", unknown>>;
  pickup_windows: { kind: "weekly" | "dated"; weekday: number | null; start_time: string | null; end_time: string | null; starts_at: string | null; ends_at: string | null }[];
}

/** A stored listing → form state in the reader's units (for the edit page). */
export function fromListing(l: StoredListingValues, system: UnitSystem): ListingFormState {
  const base = emptyForm(l.material);
  const num = (x: number) => String(round(x, 3));
  return {
    ...base,
    status: "active",
    title: l.title,
    description: l.description,
    unit: l.unit,
    quantity: num(quantityFromSi(l.quantity_total, l.unit, system)),
    unit_size: l.unit_size === null ? "" : num(unitSizeFromSi(l.unit_size, l.unit, system)),
    unit_mass_kg: l.unit_mass_kg === null ? "" : num(system === "imperial" ? kgToLb(l.unit_mass_kg) : l.unit_mass_kg),
    priced: l.pack ? "per_pack" : l.price_cents > 0 ? "priced" : "free",
    price_cents: l.pack ? "" : centsToMoney(l.price_cents),
    pack_size: l.pack ? num(quantityFromSi(l.pack.size, l.unit, system)) : "",
    pack_price_cents: l.pack ? centsToMoney(l.pack.price_cents) : "",
    currency: (["eur", "gbp", "usd"].includes(l.currency) ? l.currency : "eur") as ListingFormState["currency"],
    deposit_cents: centsToMoney(l.deposit_cents),
    max_per_reservation: l.max_per_reservation === null ? "" : num(quantityFromSi(l.max_per_reservation, l.unit, system)),
    auto_accept: l.auto_accept,
    location: { ...l.pickup.location },
    address: l.pickup.address,
    available_from: l.available_from ? l.available_from.slice(0, 10) : "",
    available_until: l.available_until ? l.available_until.slice(0, 10) : "",
    quality: {
      tape_removed: l.quality.tape_removed !== false,
      no_glossy_print: l.quality.no_glossy_print !== false,
      herbicide_history: typeof l.quality.herbicide_history === "string" ? l.quality.herbicide_history : "",
      leaf_source: typeof l.quality.leaf_source === "string" ? l.quality.leaf_source : "",
      species: typeof l.quality.species === "string" ? l.quality.species : "",
      ships: l.quality.ships !== false,
      pickup: l.quality.pickup !== false,
    },
    pickup_windows: l.pickup_windows.map((w) => ({
      kind: w.kind,
      weekday: String(w.weekday ?? 6),
      start_time: w.start_time ?? "09:00",
      end_time: w.end_time ?? "12:00",
      starts_at: fromWallClock(w.starts_at),
      ends_at: fromWallClock(w.ends_at),
    })),
  };
}
