import type { FieldErrors, Resolver } from "react-hook-form";
import { BAG_M3 } from "@/lib/calc/facts";
import { createGiveawaySchema, updateGiveawaySchema, type GiveawayMaterial, type GiveawayUnit } from "@/lib/validation/giveaways";
import { DEFAULT_TIME_ZONE, wallTime, localDate, zonedToUtc } from "@/lib/time/zoned";
import type { StaffDayView } from "@/lib/giveaways/view";

// The giveaway-day form in the words staff use (euros, litres, a local closing time), turned
// into exactly what POST/PATCH /api/council/giveaways take, and checked with the same schema.

export interface DayFormValues {
  material: GiveawayMaterial;
  title: string;
  notes: string;
  date: string;
  address: string;
  location: { lat: number; lng: number } | null;
  unit: GiveawayUnit;
  bag_litres: string;
  household_cap: string;
  closes_local: string;
  cancel_cutoff_hours: string;
  deposit_eur: string;
  slots: { start: string; end: string; capacity: string }[];
}

const num = (s: string) => (s.trim() === "" ? undefined : Number(s.replace(",", ".")));

export function defaultDayValues(today: string): DayFormValues {
  return {
    material: "leaves",
    title: "",
    notes: "",
    date: today,
    address: "",
    location: null,
    unit: "bags",
    bag_litres: String(Math.round(BAG_M3 * 1000)),
    household_cap: "6",
    closes_local: "",
    cancel_cutoff_hours: "12",
    deposit_eur: "0",
    slots: [],
  };
}

export function valuesFromDay(d: StaffDayView): DayFormValues {
  const local = (iso: string) => `${localDate(new Date(iso), d.time_zone)}T${wallTime(iso, d.time_zone)}`;
  return {
    material: d.material as GiveawayMaterial,
    title: d.title,
    notes: d.notes,
    date: d.date,
    address: d.exact.address,
    location: { lat: d.exact.lat, lng: d.exact.lng },
    unit: d.unit,
    bag_litres: d.bag_m3 ? String(Math.round(d.bag_m3 * 1000)) : String(Math.round(BAG_M3 * 1000)),
    household_cap: String(d.household_cap),
    closes_local: local(d.booking_closes_at),
    cancel_cutoff_hours: String(d.cancel_cutoff_hours),
    deposit_eur: (d.deposit_cents / 100).toFixed(2),
    slots: [],
  };
}

/** The request body; with `only`, just those form fields (an edit sends what changed). */
export function toDayBody(v: DayFormValues, only?: Set<keyof DayFormValues>): Record<string, unknown> {
  const want = (k: keyof DayFormValues) => !only || only.has(k);
  const body: Record<string, unknown> = {};
  if (want("material")) body.material = v.material;
  if (want("title")) body.title = v.title;
  if (want("notes")) body.notes = v.notes;
  if (want("date")) body.date = v.date;
  if (want("address")) body.address = v.address;
  if (want("location")) body.location = v.location ?? undefined;
  if (want("unit")) body.unit = v.unit;
  if (want("bag_litres") && v.unit === "bags") body.bag_m3 = num(v.bag_litres) === undefined ? undefined : num(v.bag_litres)! / 1000;
  if (want("household_cap")) body.household_cap = num(v.household_cap);
  if (want("cancel_cutoff_hours")) body.cancel_cutoff_hours = num(v.cancel_cutoff_hours);
  if (want("deposit_eur")) body.deposit_cents = num(v.deposit_eur) === undefined ? 0 : Math.round(num(v.deposit_eur)! * 100);
  if (want("closes_local") && v.closes_local) {
    const [d, t] = v.closes_local.split("T");
    body.booking_closes_at = zonedToUtc(d, t.slice(0, 5), DEFAULT_TIME_ZONE).toISOString();
  }
  if (!only) body.slots = v.slots.map((s) => ({ start: s.start, end: s.end, capacity: num(s.capacity) }));
  return body;
}

// Where each schema path shows up on the form.
const FIELD_FOR: Record<string, string> = { bag_m3: "bag_litres", deposit_cents: "deposit_eur", booking_closes_at: "closes_local", booking_opens_at: "closes_local" };

function formField(path: string): string {
  if (path.startsWith("location")) return "location";
  return FIELD_FOR[path] ?? path;
}

/** Checks the form with the handler's own schema, for a new day or an edit (slots are edited apart). */
export function dayResolver(mode: "create" | "edit"): Resolver<DayFormValues> {
  return async (values) => {
    const body = toDayBody(values);
    if (mode === "create" && !values.location) {
      return { values: {}, errors: { location: { type: "required", message: "Click the map where households collect." } } as FieldErrors<DayFormValues> };
    }
    const schema = mode === "create" ? createGiveawaySchema : updateGiveawaySchema;
    const { slots: _slots, ...forEdit } = body;
    const result = schema.safeParse(mode === "create" ? body : forEdit);
    if (result.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of result.error.issues) {
      const key = formField(issue.path.map(String).join("."));
      errors[key] ??= { type: issue.code, message: issue.message };
    }
    return { values: {}, errors: nest(errors) as FieldErrors<DayFormValues> };
  };
}

/** react-hook-form wants "slots.0.end" as { slots: [{ end }] }. */
function nest(flat: Record<string, unknown>) {
  const out: Record<string, unknown> = {};
  for (const [path, err] of Object.entries(flat)) {
    const parts = path.split(".");
    let at: Record<string, unknown> = out;
    parts.forEach((p, i) => {
      if (i === parts.length - 1) at[p] = err;
      else at = (at[p] ??= /^\d+$/.test(parts[i + 1]) ? [] : {}) as Record<string, unknown>;
    });
  }
  return out;
}

/** Even slots from `from` to `to`, `minutes` long, `capacity` households each. */
export function makeSlots(from: string, to: string, minutes: number, capacity: string) {
  const toMin = (t: string) => Number(t.slice(0, 2)) * 60 + Number(t.slice(3, 5));
  const fmt = (m: number) => `${String(Math.floor(m / 60)).padStart(2, "0")}:${String(m % 60).padStart(2, "0")}`;
  const out: DayFormValues["slots"] = [];
  if (!/^\d\d:\d\d$/.test(from) || !/^\d\d:\d\d$/.test(to) || !(minutes >= 5)) return out;
  for (let m = toMin(from); m + minutes <= toMin(to) && out.length < 48; m += minutes) out.push({ start: fmt(m), end: fmt(m + minutes), capacity });
  return out;
}

/**
 * A new day filled from the demand map's suggestion (/council/demand): its material, date,
 * place and as many hour-long slots from 09:00 as it would fill. Anything that does not
 * read is left as the plain default.
 */
export function suggestedDayValues(base: DayFormValues, p: Record<string, string | string[] | undefined>): DayFormValues {
  const one = (k: string) => (Array.isArray(p[k]) ? p[k]![0] : p[k]);
  const out = { ...base };
  const material = one("material");
  if (material === "leaves" || material === "wood_chips" || material === "compost") {
    out.material = material;
    if (material !== "leaves") out.unit = "m3";
  }
  const date = one("date");
  if (date && /^\d{4}-\d{2}-\d{2}$/.test(date)) out.date = date;
  const lat = Number(one("lat"));
  const lng = Number(one("lng"));
  if (Number.isFinite(lat) && Number.isFinite(lng) && Math.abs(lat) <= 90 && Math.abs(lng) <= 180 && one("lat") && one("lng")) out.location = { lat, lng };
  const slots = Math.min(12, Math.max(0, Math.floor(Number(one("slots")))));
  const capacity = Math.floor(Number(one("capacity")));
  if (slots > 0) out.slots = makeSlots("09:00", `${String(9 + slots).padStart(2, "0")}:00`, 60, String(capacity > 0 ? capacity : 10));
  return out;
}
