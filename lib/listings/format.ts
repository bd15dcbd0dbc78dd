// How listings read on screen: quantities in the reader's unit system, unit sizes, prices and
// pickup times. Pure and free of server code, so the browse list, the detail page and the
// form all say the same thing.
import { formatMoney } from "@/lib/format/money";
import { lToUsGal, m2ToFt2, m3ToFt3, kgToLb, ft2ToM2, lbToKg, yd3ToM3, type UnitSystem, type ListingUnit } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { LITRE_M3, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { unitAmount } from "@/lib/calc/mass";

const COUNT_WORDS: Record<"sheets" | "bags" | "bales", [string, string]> = {
  sheets: ["sheet", "sheets"],
  bags: ["bag", "bags"],
  bales: ["bale", "bales"],
};

const trim = (x: number, places = 2) => String(Number(x.toFixed(places)));

export function materialName(code: string): string {
  return MATERIALS[code as MaterialCode]?.name ?? code;
}

/**
 * "14 bags", "2.5 m³" or, for imperial readers, "3.27 yd³". A count is whole when it is whole
 * and never has more than two decimals ("0.33 bags"); a measure reads as formatQuantity has it.
 */
export function formatListingQuantity(quantity: number, unit: ListingUnit, system: UnitSystem = "metric"): string {
  if (unit === "sheets" || unit === "bags" || unit === "bales") {
    const [one, many] = COUNT_WORDS[unit];
    const shown = trim(quantity);
    return `${shown} ${shown === "1" ? one : many}`;
  }
  return formatQuantity(quantity, unit, system);
}

/**
 * What one sheet, bag or bale holds, e.g. "bags of about 114 L, about 14 kg" or "bales of
 * 5.25 ft³, about 44 lb". The weight is the supplier's, or else the one every other screen
 * uses for that material (lib/calc/mass.ts) when the material is given.
 */
export function describeUnitSize(
  unit: ListingUnit,
  unitSize: number | null,
  unitMassKg: number | null,
  system: UnitSystem = "metric",
  material?: MaterialCode,
): string | null {
  const imperial = system === "imperial";
  const kg = unitMassKg ?? (material && (unit === "bags" || unit === "bales") ? unitAmount(material, unit, { unit_size: unitSize })?.kg : null) ?? null;
  const weight = kg ? `about ${imperial ? `${trim(kgToLb(kg), 0)} lb` : `${trim(kg, 1)} kg`}` : null;
  if (unit === "sheets" && unitSize) return `each sheet about ${imperial ? `${trim(m2ToFt2(unitSize), 1)} ft²` : `${trim(unitSize)} m²`}`;
  if (unit === "bags" && unitSize) {
    const litres = unitSize / LITRE_M3;
    return `bags of about ${imperial ? `${trim(lToUsGal(litres), 0)} US gal` : `${trim(litres, 0)} L`}${weight ? `, ${weight}` : ""}`;
  }
  if (unit === "bales") {
    const parts: string[] = [];
    if (unitSize) parts.push(imperial ? `${trim(m3ToFt3(unitSize))} ft³` : `${trim(unitSize, 3)} m³`);
    if (weight) parts.push(weight);
    return parts.length ? `bales of ${parts.join(", ")}` : null;
  }
  return null;
}

/**
 * "£4.00 a bale", "£6.00 a kg" — or, for an imperial reader, the same price a pound, a cubic
 * yard or a square foot (rounded to the cent; the listing's own price stays per SI unit).
 */
export function formatPrice(cents: number, currency: string, unit: ListingUnit, system: UnitSystem = "metric"): string {
  if (cents === 0) return "Free";
  if (unit === "sheets" || unit === "bags" || unit === "bales") return `${formatMoney(cents, currency)} a ${COUNT_WORDS[unit][0]}`;
  if (system === "imperial") {
    const [perUnit, word] = unit === "m3" ? [yd3ToM3(1), "yd³"] : unit === "m2" ? [ft2ToM2(1), "ft²"] : [lbToKg(1), "lb"];
    return `${formatMoney(Math.max(1, Math.round(cents * perUnit)), currency)} a ${word}`;
  }
  return `${formatMoney(cents, currency)} a ${unit === "m3" ? "m³" : unit === "m2" ? "m²" : "kg"}`;
}

export const WEEKDAYS = ["Sunday", "Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday"] as const;

export interface WindowView {
  kind: "weekly" | "dated";
  weekday?: number | null;
  start_time?: string | null;
  end_time?: string | null;
  starts_at?: string | null;
  ends_at?: string | null;
}

/**
 * "Saturdays 09:00–12:00" or "Sun, 14 Mar 2027, 10:00–13:00". Pickup times are wall-clock
 * times at the pickup place, weekly and dated alike; dated ones are stored as that wall
 * clock written in UTC, so they read back exactly as the supplier typed them.
 */
export function formatWindow(w: WindowView): string {
  if (w.kind === "weekly") return `${WEEKDAYS[w.weekday ?? 0]}s ${w.start_time}–${w.end_time}`;
  const start = new Date(w.starts_at ?? "");
  const end = new Date(w.ends_at ?? "");
  const day = new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }).format(start);
  const time = (d: Date) => new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: "UTC" }).format(d);
  return `${day}, ${time(start)}–${time(end)}`;
}

export function formatDay(iso: string | null): string | null {
  if (!iso) return null;
  return new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" }).format(new Date(iso));
}

export const STATUS_LABELS: Record<string, string> = {
  draft: "Draft",
  active: "On offer",
  paused: "Paused",
  archived: "Archived",
  gone: "All taken",
  expired: "Ended",
  hidden: "Hidden by a moderator",
};
