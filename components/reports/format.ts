import { kgToLb, m3ToYd3, type UnitSystem } from "@/lib/calc/units";

export type ChartUnit = "kg" | "m³" | "lb" | "yd³";

/** A figure as the reports write it: whole kg or lb from 100 up, else one place; volumes to two places. */
export function formatFigure(n: number, unit: ChartUnit): string {
  if (unit === "m³" || unit === "yd³") return n.toLocaleString("en-GB", { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  return n >= 100 ? Math.round(n).toLocaleString("en-GB") : Number(n.toFixed(1)).toLocaleString("en-GB");
}

/** The reports' mass and volume units for a reader, and the SI figures converted to them. */
export function reportUnits(system: UnitSystem) {
  const imperial = system === "imperial";
  return {
    mass: (imperial ? "lb" : "kg") as ChartUnit,
    volume: (imperial ? "yd³" : "m³") as ChartUnit,
    fromKg: (kg: number) => (imperial ? kgToLb(kg) : kg),
    fromM3: (m3: number) => (imperial ? m3ToYd3(m3) : m3),
    massWord: imperial ? "Pounds" : "Kilograms",
    volumeWord: imperial ? "Cubic yards" : "Cubic metres",
  };
}

/** "1,234 kg" or "12.3 kg" (pounds for an imperial reader): whole units once there are enough of them. */
export function formatKg(kg: number, system: UnitSystem = "metric"): string {
  const u = reportUnits(system);
  return `${formatFigure(u.fromKg(kg), u.mass)} ${u.mass}`;
}

/** "2.40 m³" (cubic yards for an imperial reader). */
export function formatM3(m3: number, system: UnitSystem = "metric"): string {
  const u = reportUnits(system);
  return `${formatFigure(u.fromM3(m3), u.volume)} ${u.volume}`;
}
