import {
  CARDBOARD_KG_PER_M2,
  CARDBOARD_KG_PER_M2_RANGE,
  MATERIAL_SPREADS,
  MATERIALS,
  MOISTURE_PCT,
  SOAK_DRAINAGE_SHARE,
  WATER_KG_PER_L,
  type MaterialCode,
} from "./facts";

export interface WetComponent {
  /** Mass as is, water included. */
  mass_kg: number;
  /** % water, wet basis. */
  moisture_pct: number;
}

/**
 * Litres of water to bring a pile to `target_pct` moisture (wet basis). The dry matter does
 * not change when water is added, so the wet mass at the target is Σ dry / (1 − G); the
 * difference from today's mass is the water. A pile already wetter than the target needs
 * none — drying it is a matter of waiting, not of pouring.
 */
export function waterToTarget(components: readonly WetComponent[], target_pct: number = MOISTURE_PCT.target): number {
  if (!(target_pct >= 0 && target_pct < 100)) throw new RangeError("target_pct must be in [0, 100)");
  let mass = 0;
  let dry = 0;
  for (const c of components) {
    if (!(c.mass_kg >= 0 && Number.isFinite(c.mass_kg)) || !(c.moisture_pct >= 0 && c.moisture_pct <= 100)) {
      throw new RangeError("each component needs mass_kg ≥ 0 and moisture_pct in [0, 100]");
    }
    mass += c.mass_kg;
    dry += c.mass_kg * (1 - c.moisture_pct / 100);
  }
  const kg = Math.max(0, dry / (1 - target_pct / 100) - mass);
  return kg / WATER_KG_PER_L;
}

export interface SoakComponent {
  material: MaterialCode;
  /** Mass as is, at the table's figures. */
  mass_kg: number;
}

export interface Soak {
  /** Litres the layers take up to reach the target, at the table's figures. */
  to_target_l: number;
  /** The same at the published spreads' two ends: least and most. */
  to_target_range_l: [number, number];
  /** What to pour, drainage allowance included: least and most. */
  range_l: [number, number];
}

/** A component's mass and moisture at the end of its spreads that asks for the least or the most water. */
function extreme(c: SoakComponent, target_pct: number, most: boolean): WetComponent {
  const facts = MATERIALS[c.material];
  const spread = MATERIAL_SPREADS[c.material];
  const [mlo, mhi] = c.material === "cardboard" ? CARDBOARD_KG_PER_M2_RANGE.map((x) => x / CARDBOARD_KG_PER_M2) : (spread?.density_kg_m3 ?? [facts.bulk_density_kg_m3, facts.bulk_density_kg_m3]).map((d) => d / facts.bulk_density_kg_m3);
  const [wlo, whi] = spread?.moisture_pct ?? [facts.moisture_pct, facts.moisture_pct];
  // Drier asks for more; more mass asks for more while the material is drier than the target.
  const moisture_pct = most ? wlo : whi;
  const asks = (100 - moisture_pct) / (100 - target_pct) - 1 > 0;
  return { mass_kg: c.mass_kg * (asks === most ? mhi : mlo), moisture_pct };
}

/**
 * The first soak: the mass balance at the table's figures, and a range over the published
 * density and moisture spreads (MATERIAL_SPREADS; cardboard's areal mass), with the drainage
 * allowance (SOAK_DRAINAGE_SHARE) on top of what the layers take up.
 */
export function soakFor(components: readonly SoakComponent[], target_pct: number = MOISTURE_PCT.target): Soak {
  const at = (most: boolean) => waterToTarget(components.map((c) => extreme(c, target_pct, most)), target_pct);
  const central = waterToTarget(components.map((c) => ({ mass_kg: c.mass_kg, moisture_pct: MATERIALS[c.material].moisture_pct })), target_pct);
  const low = at(false);
  const high = at(true);
  const pour = (l: number) => l * (1 + SOAK_DRAINAGE_SHARE);
  return { to_target_l: central, to_target_range_l: [low, high], range_l: [pour(low), pour(high)] };
}
