// The mixture formula from Cornell Waste Management Institute, "Getting the Right Mix"
// (Composting in Schools, 1996), with Q the mass as is, C and N in % of dry mass and M the
// moisture in %:
//   C:N of the mix  R = Σ Q·C·(100 − M) / Σ Q·N·(100 − M)
//   moisture        G = Σ Q·M / Σ Q
// and %C = %N × C:N (Cornell, "C/N Ratio", Richard & Trautmann).
import { CN_RATIO, MATERIALS, type MaterialCode } from "./facts";
import { waterToTarget } from "./water";
import { formatNumber } from "@/lib/format/number";

export interface BlendComponent {
  material?: MaterialCode;
  mass_kg: number;
  moisture_pct?: number;
  n_pct?: number;
  cn_ratio?: number;
  c_pct?: number;
}

export interface BlendResult {
  cn_ratio: number;
  moisture_pct: number;
  dry_mass_kg: number;
  carbon_kg: number;
  nitrogen_kg: number;
  water_to_target_l?: number;
}

interface Resolved {
  mass_kg: number;
  moisture_pct: number;
  n_pct: number;
  c_pct: number;
}

/** Fill each gap from the material's facts; a value the caller gives always wins. */
function resolve(component: BlendComponent, index: number): Resolved {
  const facts = component.material ? MATERIALS[component.material] : undefined;
  if (component.material && !facts) throw new RangeError(`component ${index}: unknown material "${component.material}"`);
  const moisture_pct = component.moisture_pct ?? facts?.moisture_pct;
  const n_pct = component.n_pct ?? facts?.n_pct ?? undefined;
  const cn = component.cn_ratio ?? facts?.cn_ratio ?? undefined;
  const c_pct = component.c_pct ?? (n_pct !== undefined && cn !== undefined ? n_pct * cn : undefined);
  if (moisture_pct === undefined || n_pct === undefined || c_pct === undefined) {
    throw new RangeError(`component ${index}: needs moisture_pct, n_pct and one of cn_ratio or c_pct`);
  }
  if (!(component.mass_kg >= 0) || !(n_pct > 0) || !(moisture_pct >= 0 && moisture_pct < 100)) {
    throw new RangeError(`component ${index}: mass_kg ≥ 0, n_pct > 0 and moisture_pct in [0, 100) required`);
  }
  return { mass_kg: component.mass_kg, moisture_pct, n_pct, c_pct };
}

export function blend(components: readonly BlendComponent[], target_moisture_pct?: number): BlendResult {
  const parts = components.map(resolve);
  let mass = 0;
  let water = 0;
  let dry = 0;
  let carbon = 0;
  let nitrogen = 0;
  for (const p of parts) {
    const d = p.mass_kg * (1 - p.moisture_pct / 100);
    mass += p.mass_kg;
    water += p.mass_kg * p.moisture_pct / 100;
    dry += d;
    carbon += (d * p.c_pct) / 100;
    nitrogen += (d * p.n_pct) / 100;
  }
  if (!(nitrogen > 0)) throw new RangeError("the blend needs some dry mass with nitrogen in it");
  const result: BlendResult = {
    cn_ratio: carbon / nitrogen,
    moisture_pct: (100 * water) / mass,
    dry_mass_kg: dry,
    carbon_kg: carbon,
    nitrogen_kg: nitrogen,
  };
  if (target_moisture_pct !== undefined) {
    result.water_to_target_l = waterToTarget(parts, target_moisture_pct);
  }
  return result;
}

/**
 * kg (as is) of `material` that brings the blend's C:N exactly to `target`. Adding q kg with
 * dry fraction d, %C c and %N n gives (C + q·d·c) / (N + q·d·n) = R, which is linear in q:
 *   q = (C − R·N) / (d·(R·n − c))
 * Returns null when the material pushes the ratio the wrong way or can never reach it.
 */
export function massToReachCn(
  mix: Pick<BlendResult, "carbon_kg" | "nitrogen_kg">,
  material: MaterialCode,
  target: number,
): number | null {
  const add = resolve({ material, mass_kg: 1 }, 0);
  const d = 1 - add.moisture_pct / 100;
  const c = add.c_pct / 100;
  const n = add.n_pct / 100;
  const denominator = d * (target * n - c);
  if (denominator === 0) return null;
  const q = (mix.carbon_kg - target * mix.nitrogen_kg) / denominator;
  return q >= 0 && Number.isFinite(q) ? q : null;
}

const NITROGEN_SOURCES: readonly MaterialCode[] = ["grass_clippings", "coffee_grounds"];
const CARBON_SOURCES: readonly MaterialCode[] = ["leaves", "straw", "cardboard"];

// Rounded up, so following the advice lands inside the range rather than just short of it.
function kgText(kg: number): string {
  const step = kg < 10 ? 0.1 : 1;
  const up = Math.ceil(kg / step - 1e-9) * step;
  return `${formatNumber(up, kg < 10 ? 1 : 0)} kg`;
}

function orList(items: string[]): string {
  return items.length < 2 ? items.join("") : `${items.slice(0, -1).join(", ")} or ${items[items.length - 1]}`;
}

/**
 * One sentence on what would bring the mix into the 25–40 C:N range (The Composting
 * Handbook, 2022, Table 4.2), or null when it is already there.
 */
export function blendAdvice(input: BlendResult | readonly BlendComponent[]): string | null {
  const mix = Array.isArray(input) ? blend(input as readonly BlendComponent[]) : (input as BlendResult);
  const ratio = mix.carbon_kg / mix.nitrogen_kg;
  const tooCarbon = ratio > CN_RATIO.ideal_max;
  if (!tooCarbon && ratio >= CN_RATIO.ideal_min) return null;
  const target = tooCarbon ? CN_RATIO.ideal_max : CN_RATIO.ideal_min;
  const options = (tooCarbon ? NITROGEN_SOURCES : CARBON_SOURCES).flatMap((code) => {
    const kg = massToReachCn(mix, code, target);
    return kg === null ? [] : [`${kgText(kg)} of ${MATERIALS[code].name.toLowerCase()}`];
  });
  // 40.3 must not read as "40", which is in range.
  const whole = Math.round(ratio);
  const shown = whole >= CN_RATIO.ideal_min && whole <= CN_RATIO.ideal_max ? ratio.toFixed(1) : String(whole);
  return tooCarbon
    ? `At C:N ${shown} this mix is rich in carbon and will break down slowly. Mixing in about ${orList(options)} would bring it down to ${target}.`
    : `At C:N ${shown} this mix is rich in nitrogen and may smell as it breaks down. Mixing in about ${orList(options)} would bring it up to ${target}.`;
}
