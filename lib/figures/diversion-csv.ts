import { toCsv } from "@/lib/format/csv";
import type { MaterialCode } from "@/lib/calc/facts";
import type { DiversionSummary } from "@/lib/calc/diversion";

export function diversionCsv(report: DiversionReport, by: "month" | "day" = "month"): string {
  if (by === "day") {
    return toCsv(
      ["date", "giveaway_day", "material", "kg", "m3", "households"],
      report.by_day.map((d) => [d.date, d.title, d.material, d.kg, d.m3, d.households]),
    );
  }
  return toCsv(
    ["month", "material", "kg", "m3", "households", "collections"],
    report.by_month.map((m) => [m.month, m.material, m.kg, m.m3, m.households, m.collections]),
  );
}

export interface DiversionReport extends DiversionSummary {
  /** The densities the masses come from, each with its source. */
  densities: { material: MaterialCode; bulk_density_kg_m3: number; source: string }[];
}
