// What a bed needs, from its size and the layers chosen. The input is whatever
// estimateSchema accepts (layers left out take their defaults here, so a caller that skips
// the schema gets the same answer as one that uses it).
import type { Polygon } from "geojson";
import type { EstimateInput } from "@/lib/validation/estimate";
import { polygonArea, polygonCentroid, rectangleArea } from "./area";
import { type BlendComponent, blend } from "./blend";
import { type BedAdvice, bedAdvice } from "./bed-advice";
import { cardboardFor } from "./cardboard";
import { estimateCautions } from "./cautions";
import { LAYER_DEPTH_CM, MOISTURE_PCT, SETTLED_SHARE, SOAK_DRAINAGE_SHARE, WORM_STOCKING_KG_PER_M2 } from "./facts";
import { bagsFor, balesFor, layerVolume } from "./layers";
import { massOf } from "./mass";
import { roundTo } from "./numbers";
import { type BedMilestones, bedMilestones, type TimelineEvent, timeline, type TopUpAmount } from "./timeline";
import { lToUsGal } from "./units";
import { soakFor } from "./water";
import { roundLitres, roundUsGallons } from "@/lib/format/quantity";
import { wormsFor } from "./worms";

export interface CardboardLine {
  material: "cardboard";
  quantity: number;
  unit: "m2";
  sheets: number;
  mass_kg: number;
}
export interface VolumeLine<M extends "leaves" | "straw" | "wood_chips"> {
  material: M;
  quantity: number;
  unit: "m3";
  mass_kg: number;
  depth_cm: number;
}
export interface WormsLine {
  material: "worms";
  quantity: number;
  unit: "kg";
  count: number;
}
export type NeedLine =
  | CardboardLine
  | (VolumeLine<"leaves"> & { bags: number })
  | (VolumeLine<"straw"> & { bales: number })
  | VolumeLine<"wood_chips">
  | WormsLine;

export interface EstimateResult {
  area_m2: number;
  needs: NeedLine[];
  /** The first soak to pour, the middle of water_range_l (drainage allowance included). */
  water_l: number;
  water_us_gal: number;
  /** Least and most to pour, over the published density and moisture spreads. */
  water_range_l: [number, number];
  water_range_us_gal: [number, number];
  /** water_l as a depth over the bed (1 L on 1 m² is 1 mm). */
  water_depth_mm: number;
  /** How the soak is made up; the squeeze test is the real guide. */
  water: {
    /** What the layers take up to reach the target moisture, at the table's figures and at the spreads' ends. */
    to_target_l: number;
    to_target_range_l: [number, number];
    /** The allowance for what drains into the soil below, as a share of what the layers take up (common practice). */
    drainage_share: number;
    target_moisture_pct: number;
    guide: string;
  };
  /**
   * Null ratios when no layer that composts was chosen. `advice` is what the bed could add
   * as layers it can take, in the request's units; `bed_advice` the same in figures (SI).
   */
  blend: { cn_ratio: number | null; moisture_pct: number | null; advice: string | null; bed_advice: BedAdvice | null };
  timeline: TimelineEvent[];
  /** When you can plant into the bed (about 6–9 months) and when most of it is soil (about a year). */
  planting: BedMilestones;
  /** The loose layers' depth as built, and about how deep they will have sunk to (common practice). */
  settling: { built_depth_cm: number; after: { months: 3 | 6 | 12; depth_cm: number }[] };
  /** Each seasonal top-up with what it takes for this bed. */
  top_ups: ({ date: string } & TopUpAmount)[];
  cautions: string[];
  centroid?: { lat: number; lng: number };
}

type BedShape = { length_m: number; width_m: number } | { polygon: Polygon };

const M3 = 3;
const KG = 2;

type Setting<T> = boolean | T | undefined;
/** undefined → the layer's default, true → on with defaults, false → off, object → on with those settings. */
function setting<T extends object>(value: Setting<T>, onByDefault: boolean): Partial<T> | null {
  if (value === undefined) return onByDefault ? {} : null;
  if (typeof value === "boolean") return value ? {} : null;
  return value;
}

function todayUtc(now: Date): string {
  return now.toISOString().slice(0, 10);
}

/**
 * `now` only supplies the start date when the input has none, so the function stays pure
 * for a given input and clock.
 */
export function estimate(input: EstimateInput, now: Date = new Date()): EstimateResult {
  // Only the shape matters below; a parsed bed never carries both forms.
  const bed: BedShape = "polygon" in input.bed ? { polygon: input.bed.polygon } : { length_m: input.bed.length_m, width_m: input.bed.width_m };
  const area = "polygon" in bed ? polygonArea(bed.polygon) : rectangleArea(bed.length_m, bed.width_m);
  const centroid = "polygon" in bed ? polygonCentroid(bed.polygon) : undefined;
  const layers = input.layers ?? {};
  const cardboard = setting(layers.cardboard, true);
  const leaves = setting(layers.leaves, true);
  const straw = setting(layers.straw, true);
  const chips = setting(layers.wood_chips, false);
  const worms = setting(layers.worms, true);

  const needs: NeedLine[] = [];
  const composting: BlendComponent[] = [];

  if (cardboard) {
    const sheets = cardboardFor(bed, cardboard);
    const mass = massOf("cardboard", sheets.area_m2, "m2");
    needs.push({ material: "cardboard", quantity: roundTo(sheets.area_m2, 2), unit: "m2", sheets: sheets.sheets, mass_kg: roundTo(mass, KG) });
    composting.push({ material: "cardboard", mass_kg: mass });
  }
  let built_depth_cm = 0;
  const spreadLayer = <M extends "leaves" | "straw" | "wood_chips">(material: M, depth_cm: number) => {
    built_depth_cm += depth_cm;
    const m3 = layerVolume(area, depth_cm);
    const mass = massOf(material, m3, "m3");
    composting.push({ material, mass_kg: mass });
    return { m3, line: { material, quantity: roundTo(m3, M3), unit: "m3" as const, mass_kg: roundTo(mass, KG), depth_cm } };
  };
  if (leaves) {
    const { m3, line } = spreadLayer("leaves", leaves.depth_cm ?? LAYER_DEPTH_CM.leaves.default);
    needs.push({ ...line, bags: bagsFor(m3) });
  }
  if (straw) {
    const { m3, line } = spreadLayer("straw", straw.depth_cm ?? LAYER_DEPTH_CM.straw.default);
    needs.push({ ...line, bales: balesFor(m3) });
  }
  if (chips) {
    needs.push(spreadLayer("wood_chips", chips.depth_cm ?? LAYER_DEPTH_CM.wood_chips.default).line);
  }
  if (worms) {
    const w = wormsFor(area, worms.kg_per_m2 ?? WORM_STOCKING_KG_PER_M2);
    needs.push({ material: "worms", quantity: roundTo(w.kg, KG), unit: "kg", count: w.count });
  }

  const target = input.target_moisture_pct ?? MOISTURE_PCT.target;
  const mix = composting.length > 0 ? blend(composting, target) : null;
  const latitude = input.latitude ?? centroid?.lat ?? null;
  const units = input.units ?? "metric";
  const advice = mix ? bedAdvice(mix, area, units) : null;
  const start = input.start_date ?? todayUtc(now);
  const events = timeline(start, latitude, { worms: worms !== null, bed: { area_m2: area, built_depth_cm }, units });

  return {
    area_m2: roundTo(area, 2),
    needs,
    ...soakFields(composting, target, area),
    blend: {
      cn_ratio: mix ? roundTo(mix.cn_ratio, 1) : null,
      moisture_pct: mix ? roundTo(mix.moisture_pct, 1) : null,
      advice: advice?.text ?? null,
      bed_advice: advice,
    },
    timeline: events,
    planting: bedMilestones(start),
    settling: {
      built_depth_cm: roundTo(built_depth_cm, 1),
      after: ([3, 6, 12] as const).map((months) => ({ months, depth_cm: roundTo(built_depth_cm * SETTLED_SHARE[months], 1) })),
    },
    top_ups: events.flatMap((e) => (e.top_up ? [{ date: e.date, ...e.top_up }] : [])),
    cautions: estimateCautions({
      cardboard: cardboard !== null,
      leaves: leaves !== null,
      straw: straw !== null,
      wood_chips: chips !== null,
      worms: worms !== null,
    }, units),
    ...(centroid ? { centroid } : {}),
  };
}

const SQUEEZE_GUIDE =
  "Soak each layer as you build until a squeezed handful gives a few drops and no steady drip; the figure is only a guide to how much to have ready.";

/** The soak's fields, rounded to what a person pours (5 or 10 L; gallons likewise). */
function soakFields(composting: readonly BlendComponent[], target: number, area_m2: number) {
  const parts = composting.map((c) => ({ material: c.material!, mass_kg: c.mass_kg }));
  const soak = parts.length > 0 ? soakFor(parts, target) : { to_target_l: 0, to_target_range_l: [0, 0] as [number, number], range_l: [0, 0] as [number, number] };
  const [low, high] = soak.range_l;
  const middle = (low + high) / 2;
  return {
    water_l: roundLitres(middle),
    water_us_gal: roundUsGallons(lToUsGal(middle)),
    water_range_l: [roundLitres(low), roundLitres(high)] as [number, number],
    water_range_us_gal: [roundUsGallons(lToUsGal(low)), roundUsGallons(lToUsGal(high))] as [number, number],
    water_depth_mm: Math.round(middle / area_m2),
    water: {
      to_target_l: roundTo(soak.to_target_l, 1),
      to_target_range_l: [roundTo(soak.to_target_range_l[0], 1), roundTo(soak.to_target_range_l[1], 1)] as [number, number],
      drainage_share: SOAK_DRAINAGE_SHARE,
      target_moisture_pct: target,
      guide: SQUEEZE_GUIDE,
    },
  };
}
