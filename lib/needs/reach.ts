// How far a need reaches, in bands. Each open need is filed under the smallest band that
// holds its radius, so a new listing looks for the needs that could want it band by band,
// each inside a box only as wide as that band (migrations/20261208_020_open_needs.ts).
// Product choices: a walk, a short drive, the next village, the district, a day out.

/** The longest radius a need may have, km (a product limit: beyond it nobody collects leaves). */
export const MAX_NEED_RADIUS_KM = 50;
/** The radius a need starts with when none is given, km. */
export const DEFAULT_NEED_RADIUS_KM = 10;

export const REACH_BANDS_KM = [2, 5, 10, 25, MAX_NEED_RADIUS_KM] as const;
export type ReachBand = (typeof REACH_BANDS_KM)[number];

/** The smallest band holding `radiusKm` (which must be in (0, MAX_NEED_RADIUS_KM]). */
export function reachBand(radiusKm: number): ReachBand {
  if (!(radiusKm > 0) || radiusKm > MAX_NEED_RADIUS_KM) throw new RangeError(`a need's radius must be more than 0 and at most ${MAX_NEED_RADIUS_KM} km`);
  return REACH_BANDS_KM.find((b) => radiusKm <= b)!;
}
