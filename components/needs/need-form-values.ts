// The need form holds what a gardener types, in their own units (bags or cubic yards, miles);
// the API takes SI. This is the only crossing, and the form's resolver runs the shared
// schema on the converted body, so form and route check exactly the same rules.
import type { MaterialCode } from "@/lib/calc/facts";
import { kmToMi, miToKm, type UnitSystem } from "@/lib/calc/units";
import type { NeedUnit } from "@/lib/match/types";
import { fromSiNeed, needInputUnits, toSiNeed, type NeedInputUnit } from "@/lib/needs/units";
import { DEFAULT_NEED_RADIUS_KM, MAX_NEED_RADIUS_KM } from "@/lib/needs/reach";
import type { NeedAlertMode } from "@/lib/validation/needs";

export interface NeedFormValues {
  material: MaterialCode;
  /** In `unit`, as typed. */
  quantity: string;
  unit: NeedInputUnit;
  /** In km, or miles for imperial readers, as typed. */
  radius_km: string;
  needed_by: string;
  /** A bed's id, or "" for a place picked on the map. */
  bed_id: string;
  location: { lat: number | null; lng: number | null };
  alerts: NeedAlertMode;
}

const trimmed = (x: number, places: number) => String(Number(x.toFixed(places)));

/** The distance unit radii are typed in. */
export const radiusSymbol = (system: UnitSystem) => (system === "imperial" ? "mi" : "km");
export const maxRadiusShown = (system: UnitSystem) => (system === "imperial" ? Math.floor(kmToMi(MAX_NEED_RADIUS_KM) * 10) / 10 : MAX_NEED_RADIUS_KM);

/** A fresh form, or one filled with a bed's unmet need (SI) in the reader's units. */
export function needFormValues(
  system: UnitSystem,
  start: { material?: MaterialCode; quantity?: number; unit?: NeedUnit; radius_km?: number; bed_id?: string; needed_by?: string } = {},
): NeedFormValues {
  const material = start.material ?? "leaves";
  const options = needInputUnits(material, system);
  // The first option for the unit the need came in (bags for a loose volume).
  const unit = (start.unit ? options.find((o) => o.si === start.unit) : options[0])?.code ?? options[0].code;
  const radius = Math.min(start.radius_km ?? DEFAULT_NEED_RADIUS_KM, MAX_NEED_RADIUS_KM);
  return {
    material,
    quantity: start.quantity ? trimmed(fromSiNeed(start.quantity, unit), unit === "bags" ? 1 : 2) : "",
    unit,
    // Rounded down, so a radius at the limit does not come back a hair over it.
    radius_km: String(Math.floor((system === "imperial" ? kmToMi(radius) : radius) * 10 + 1e-9) / 10),
    needed_by: start.needed_by ?? "",
    bed_id: start.bed_id ?? "",
    location: { lat: null, lng: null },
    alerts: "daily",
  };
}

const numberOrNaN = (s: string) => (s.trim() === "" ? Number.NaN : Number(s.replace(",", ".")));

/** Form state → the POST /api/needs body. Numbers that do not parse become NaN for the schema to name. */
export function toNeedBody(v: NeedFormValues, system: UnitSystem) {
  const amount = numberOrNaN(v.quantity);
  const si = Number.isFinite(amount) ? toSiNeed(amount, v.unit) : { quantity: amount, unit: toSiNeed(1, v.unit).unit };
  const radius = numberOrNaN(v.radius_km);
  const where = v.bed_id ? { bed_id: v.bed_id } : v.location.lat !== null && v.location.lng !== null ? { location: { lat: v.location.lat, lng: v.location.lng } } : {};
  return {
    material: v.material,
    quantity: si.quantity,
    unit: si.unit,
    radius_km: system === "imperial" && Number.isFinite(radius) ? miToKm(radius) : radius,
    ...(v.needed_by ? { needed_by: v.needed_by } : {}),
    ...where,
    alerts: v.alerts,
  };
}
