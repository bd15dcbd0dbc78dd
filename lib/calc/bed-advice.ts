// C:N advice a sheet-mulch bed can follow. The mix calculator's advice (blend.ts) names the
// mass of clippings that would bring any pile into range, however much that is; a bed takes
// its extras as layers, and a layer of clippings thicker than a few centimetres mats into a
// wet, airless sheet. So here each extra is offered only as deep as a layer of it may go
// (GREEN_LAYER_MAX_CM), in depth, volume, bags and mass; when that cannot reach the range
// the advice says so and names the next step, which may simply be to wait.
import { type BlendResult, massToReachCn } from "./blend";
import { BAG_M3, BROWN_LAYER_MAX_CM, CN_RATIO, GREEN_LAYER_MAX_CM, MATERIALS, type MaterialCode } from "./facts";
import { massOf } from "./mass";
import { ceilWhole, roundTo } from "./numbers";
import { formatQuantity } from "@/lib/format/quantity";
import type { UnitSystem } from "./units";

export interface LayerSuggestion {
  material: MaterialCode;
  depth_cm: number;
  m3: number;
  /** 30 US gal bags of it (common practice size). */
  bags: number;
  kg: number;
  /** C:N of the bed with this layer (and the ones before it) added. */
  cn_after: number;
  /** True when this layer brings the bed into the 25–40 range. */
  reaches_range: boolean;
  /** True when the layer is as deep as it may go. */
  capped: boolean;
}

export interface BedAdvice {
  cn_ratio: number;
  verdict: "in_range" | "carbon_rich" | "nitrogen_rich";
  /** The first layer to add (grass clippings, or leaves for a bed too rich in nitrogen). */
  first: LayerSuggestion | null;
  /** Thin layers to add on top of the first when it cannot reach the range alone. */
  then: LayerSuggestion[];
  /** Nothing within the layer limits reaches the range: a slow bed, which is fine. */
  patience: boolean;
  /** The advice as one short paragraph, in the reader's units; null in range. */
  text: string | null;
}

type Mix = Pick<BlendResult, "carbon_kg" | "nitrogen_kg">;

function added(mix: Mix, material: MaterialCode, kg: number): Mix {
  const f = MATERIALS[material];
  const dry = kg * (1 - f.moisture_pct / 100);
  return { carbon_kg: mix.carbon_kg + (dry * f.n_pct! * f.cn_ratio!) / 100, nitrogen_kg: mix.nitrogen_kg + (dry * f.n_pct!) / 100 };
}

const ratio = (m: Mix) => m.carbon_kg / m.nitrogen_kg;
const inRange = (r: number) => r >= CN_RATIO.ideal_min - 1e-9 && r <= CN_RATIO.ideal_max + 1e-9;

/**
 * A layer of `material` over `area_m2`: just deep enough to bring the mix to `target`
 * (rounded up to the half centimetre, so following it lands inside), but never past `max_cm`.
 */
function layer(mix: Mix, material: MaterialCode, area_m2: number, target: number, max_cm: number): { suggestion: LayerSuggestion; mix: Mix } | null {
  const kgToReach = massToReachCn(mix, material, target);
  if (kgToReach === null) return null;
  const per_cm = massOf(material, area_m2 / 100, "m3"); // kg in a 1 cm layer
  const wanted = Math.ceil((kgToReach / per_cm) * 2 - 1e-9) / 2;
  const depth_cm = Math.min(max_cm, Math.max(0.5, wanted));
  const m3 = (area_m2 * depth_cm) / 100;
  const kg = per_cm * depth_cm;
  const after = added(mix, material, kg);
  return {
    mix: after,
    suggestion: {
      material,
      depth_cm,
      m3: roundTo(m3, 3),
      bags: Math.max(1, ceilWhole(m3 / BAG_M3)),
      kg: roundTo(kg, 1),
      cn_after: roundTo(ratio(after), 1),
      reaches_range: inRange(ratio(after)),
      capped: wanted > max_cm,
    },
  };
}

const THIN_GREENS = ["manure", "coffee_grounds"] as const;

/** What a bed of `area_m2` with this mix could add, as layers it can take. */
export function bedAdvice(mix: Mix, area_m2: number, system: UnitSystem = "metric"): BedAdvice {
  const r = ratio(mix);
  const base = { cn_ratio: roundTo(r, 1), first: null, then: [], patience: false, text: null };
  if (inRange(r)) return { ...base, verdict: "in_range" };
  if (r > CN_RATIO.ideal_max) {
    const target = CN_RATIO.ideal_max;
    const first = layer(mix, "grass_clippings", area_m2, target, GREEN_LAYER_MAX_CM.grass_clippings)!;
    const then = first.suggestion.reaches_range
      ? []
      : THIN_GREENS.flatMap((m) => layer(first.mix, m, area_m2, target, GREEN_LAYER_MAX_CM[m])?.suggestion ?? []);
    const patience = !first.suggestion.reaches_range && !then.some((t) => t.reaches_range);
    const advice = { ...base, verdict: "carbon_rich" as const, first: first.suggestion, then, patience };
    return { ...advice, text: carbonText(advice, system) };
  }
  const target = CN_RATIO.ideal_min;
  const first = layer(mix, "leaves", area_m2, target, BROWN_LAYER_MAX_CM.leaves)!;
  const then = first.suggestion.reaches_range ? [] : [layer(first.mix, "straw", area_m2, target, BROWN_LAYER_MAX_CM.straw)!.suggestion];
  const patience = !first.suggestion.reaches_range && !then.some((t) => t.reaches_range);
  const advice = { ...base, verdict: "nitrogen_rich" as const, first: first.suggestion, then, patience };
  return { ...advice, text: nitrogenText(advice, system) };
}

// --- words ---------------------------------------------------------------------------------

const name = (m: MaterialCode) => MATERIALS[m].name.toLowerCase().replace("horse manure", "well-rotted horse manure");

/** "a 3 cm layer of grass clippings (0.14 m³, about 2 bags, 29 kg)". */
export function layerPhrase(s: LayerSuggestion, system: UnitSystem): string {
  const bags = `about ${s.bags} ${s.bags === 1 ? "bag" : "bags"}`;
  return `a ${formatQuantity(s.depth_cm, "cm", system)} layer of ${name(s.material)} (${formatQuantity(s.m3, "m3", system)}, ${bags}, ${formatQuantity(s.kg, "kg", system)})`;
}

// The matting caution for clippings (common practice, no source).
export const CLIPPINGS_CAUTION = "Spread clippings thin or let them wilt for a day first: a thick wet layer mats into an airless sheet that smells.";

function shown(r: number): string {
  // 40.3 must not read as "40", which is in range.
  const whole = Math.round(r);
  return whole >= CN_RATIO.ideal_min && whole <= CN_RATIO.ideal_max && !inRange(r) ? r.toFixed(1) : String(whole);
}

function carbonText(a: Omit<BedAdvice, "text">, system: UnitSystem): string {
  const first = a.first!;
  const cap = formatQuantity(GREEN_LAYER_MAX_CM.grass_clippings, "cm", system);
  const opening = `At C:N ${shown(a.cn_ratio)} this bed is rich in carbon and will break down slowly.`;
  if (first.reaches_range) {
    return `${opening} Adding ${layerPhrase(first, system)} between the leaves would bring it to about ${shown(first.cn_after)}. ${CLIPPINGS_CAUTION}`;
  }
  const start = `${opening} Grass clippings can go no deeper than about ${cap} without matting: ${layerPhrase(first, system)} brings it to about ${shown(first.cn_after)}, short of ${CN_RATIO.ideal_max}. ${CLIPPINGS_CAUTION}`;
  const reaching = a.then.filter((t) => t.reaches_range);
  if (reaching.length) {
    const options = reaching.map((t) => layerPhrase(t, system)).join(" or ");
    return `${start} To get the rest of the way, add ${options} as well.`;
  }
  const thin = a.then.map((t) => `${layerPhrase(t, system)} takes it to about ${shown(t.cn_after)}`).join("; ");
  return `${start}${thin ? ` On top of that, ${thin}.` : ""} Or simply let it be: a slow bed is fine for sheet mulching, and it will be ready a few months later.`;
}

function nitrogenText(a: Omit<BedAdvice, "text">, system: UnitSystem): string {
  const first = a.first!;
  const opening = `At C:N ${shown(a.cn_ratio)} this bed is rich in nitrogen and may smell as it breaks down.`;
  if (first.reaches_range) return `${opening} Adding ${layerPhrase(first, system)} would bring it up to about ${shown(first.cn_after)}.`;
  const more = a.then.map((t) => layerPhrase(t, system)).join(" and ");
  return `${opening} ${layerPhrase(first, system)[0].toUpperCase()}${layerPhrase(first, system).slice(1)} brings it to about ${shown(first.cn_after)}${more ? `; ${more} on top takes it to about ${shown(a.then.at(-1)!.cn_after)}` : ""}. Keep the bed open to the air while it settles.`;
}
