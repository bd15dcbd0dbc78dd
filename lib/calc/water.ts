import { MOISTURE_PCT, WATER_KG_PER_L } from "./facts";

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
