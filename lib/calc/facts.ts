// The one table of facts behind every Duffbank calculation. Each value names its source,
// or says "common practice, no source" or "from memory", so a reader can judge how far to
// trust it. Derived values are computed here from the exact NIST factors rather than typed
// in, so a change to a definition cannot leave a stale copy behind.

// ---------------------------------------------------------------------------------------
// Units — NIST Handbook 44, Appendix C (exact by definition)
// ---------------------------------------------------------------------------------------

/** NIST HB44 App. C: 1 inch = 0.0254 m exactly. */
export const INCH_M = 0.0254;
/** NIST HB44 App. C: 1 foot = 12 inches; 1 yard = 3 feet. */
export const INCHES_PER_FOOT = 12;
export const FEET_PER_YARD = 3;
/** NIST HB44 App. C: 1 (statute) mile = 5,280 feet. */
export const FEET_PER_MILE = 5280;
/** NIST HB44 App. C: 1 US liquid gallon = 231 cubic inches exactly. */
export const US_GALLON_IN3 = 231;
/** NIST HB44 App. C: 1 avoirdupois pound = 0.45359237 kg exactly. */
export const POUND_KG = 0.45359237;
/** SI (NIST SP 811): 1 litre = 1 dm³ = 0.001 m³ exactly. */
export const LITRE_M3 = 0.001;
/** Water at garden temperatures is 1 kg per litre to within 0.3 %, close enough to add water by weight (common practice, no source). */
export const WATER_KG_PER_L = 1;

// Derived: 0.3048 m, 0.9144 m, 231 × 0.0254³ = 0.003785411784 m³.
export const FOOT_M = INCHES_PER_FOOT * INCH_M;
export const YARD_M = FEET_PER_YARD * FOOT_M;
export const US_GALLON_M3 = US_GALLON_IN3 * INCH_M ** 3;

/**
 * The sphere Turf measures on: 6,371,008.8 m, the IUGG/GRS80 mean radius rounded. Local
 * projections use the same one so they agree with polygonArea.
 */
export const EARTH_MEAN_RADIUS_M = 6_371_008.8;

// Density conversions, derived:
//   1 lb/US gal = 0.45359237 kg / 0.003785411784 m³ = 119.826427 kg/m³
//   1 lb/yd³    = 0.45359237 kg / 0.764554857984 m³ = 0.593276 kg/m³
const KG_M3_PER_LB_PER_GAL = POUND_KG / US_GALLON_M3;
const KG_M3_PER_LB_PER_YD3 = POUND_KG / YARD_M ** 3;
//   1 lb/ft³    = 0.45359237 kg / 0.028316846592 m³ = 16.018463 kg/m³
const KG_M3_PER_LB_PER_FT3 = POUND_KG / FOOT_M ** 3;

// ---------------------------------------------------------------------------------------
// Materials
// ---------------------------------------------------------------------------------------

export type MaterialCode =
  | "cardboard"
  | "leaves"
  | "straw"
  | "worms"
  | "grass_clippings"
  | "coffee_grounds"
  | "wood_chips"
  | "manure"
  | "compost";

export const MATERIAL_CODES: readonly MaterialCode[] = [
  "cardboard",
  "leaves",
  "straw",
  "worms",
  "grass_clippings",
  "coffee_grounds",
  "wood_chips",
  "manure",
  "compost",
];

export interface MaterialFacts {
  code: MaterialCode;
  name: string;
  /** Nitrogen, % of dry mass. */
  n_pct: number | null;
  /** Carbon to nitrogen, by mass. */
  cn_ratio: number | null;
  /** Water, % of mass as is (wet basis). */
  moisture_pct: number;
  /** Mass per volume as the material is usually handed over (loose, or in the bale). */
  bulk_density_kg_m3: number;
  default_unit: "m2" | "m3" | "kg";
  /**
   * Baled and spread: the material comes compressed in bales and fills this many times a
   * bale's volume once loosened on a bed (straw, and hay if it is ever listed). Absent for
   * everything else, including leaves or chips someone has tied into bales: those spread to
   * the volume they were handed over in.
   */
  bale_expansion?: number;
  source: string;
}

const NRAES = "NRAES-54 (On-Farm Composting Handbook, 1992) Table A.1";
const MST = "Missouri S&T compost-mixture table";

// Baled 7–12 lb/ft³ against loose 1–3 lb/ft³ (biomass handling texts; publisher not
// verified, so common practice) puts the ratio anywhere from about 2.3 to 12. A built bed
// is watered and settles toward the dense end of "loose", so we take 3: it sits near the
// low end, which errs toward asking for one bale too many rather than one too few.
/** Spread volume one bale covers = bale volume × this factor (common practice, no source; reasoning above). */
export const BALE_EXPANSION_FACTOR = 3;

/** Two-string small square bale, 14 × 18 × 36 in = 5.25 ft³ = 0.1487 m³ (common practice, no source). */
export const BALE_IN = { height: 14, width: 18, length: 36 } as const;
export const BALE_M3 = BALE_IN.height * BALE_IN.width * BALE_IN.length * INCH_M ** 3;
/**
 * A small bale weighs 40–60 lb, 18–27 kg (common practice, no source). The default, 45 lb
 * (20.4 kg), lies inside that range and keeps the two density ranges above in step: in the
 * bale 45 / 5.25 = 8.6 lb/ft³ (baled: 7–12), spread to three times the volume 2.9 lb/ft³
 * (loose: 1–3). A listing's own bale weight always wins.
 */
export const BALE_MASS_LB = { min: 40, max: 60, default: 45 } as const;
export const BALE_KG = BALE_MASS_LB.default * POUND_KG;

export const MATERIALS: Record<MaterialCode, MaterialFacts> = {
  cardboard: {
    code: "cardboard",
    name: "Corrugated cardboard",
    n_pct: 0.1,
    cn_ratio: 563,
    moisture_pct: 8,
    // 0.5 lb/gal × 119.826 = 59.9 kg/m³; US EPA ORCR (2016) gives 106 lb/yd³ = 62.9 kg/m³, a good match.
    bulk_density_kg_m3: 0.5 * KG_M3_PER_LB_PER_GAL,
    default_unit: "m2",
    source: `%N, C:N, moisture: ${NRAES}; density 0.5 lb/US gal: ${MST}`,
  },
  leaves: {
    code: "leaves",
    name: "Fallen leaves",
    n_pct: 0.9,
    cn_ratio: 54,
    moisture_pct: 38,
    // Loose dry leaves 1 lb/gal × 119.826 = 119.8 kg/m³ (compacted: 2 lb/gal).
    bulk_density_kg_m3: 1 * KG_M3_PER_LB_PER_GAL,
    default_unit: "m3",
    source: `%N, C:N, moisture: ${NRAES}; density 1 lb/US gal (loose, dry): ${MST}`,
  },
  straw: {
    code: "straw",
    name: "Straw",
    n_pct: 0.7,
    cn_ratio: 80,
    moisture_pct: 12,
    // Loose, as spread on a bed: a default bale (BALE_KG in BALE_M3) loosened to
    // BALE_EXPANSION_FACTOR times its volume, 20.41 / 0.4461 = 45.8 kg/m³ = 2.9 lb/ft³.
    // Missouri S&T's 1 lb/US gal (7.5 lb/ft³) is straw in the bale, at the light end.
    bulk_density_kg_m3: BALE_KG / (BALE_M3 * BALE_EXPANSION_FACTOR),
    default_unit: "m3",
    bale_expansion: BALE_EXPANSION_FACTOR,
    source: `%N, C:N, moisture: ${NRAES} (straw, general); density: a 45 lb small bale spread to three times its volume (common practice, no source)`,
  },
  worms: {
    code: "worms",
    name: "Composting worms (Eisenia fetida)",
    n_pct: null,
    cn_ratio: null,
    // Worms are sold and stocked by weight and never enter the blend, so these two only
    // keep the table complete: living tissue is mostly water and about as dense as water.
    moisture_pct: 80,
    bulk_density_kg_m3: 1000,
    default_unit: "kg",
    source: "from memory (moisture about 80 %, density about that of water; neither is used in a calculation)",
  },
  grass_clippings: {
    code: "grass_clippings",
    name: "Grass clippings",
    n_pct: 3.4,
    cn_ratio: 17,
    moisture_pct: 82,
    // Loose 1.7 lb/gal × 119.826 = 203.7 kg/m³ (compacted: 3.2 lb/gal).
    bulk_density_kg_m3: 1.7 * KG_M3_PER_LB_PER_GAL,
    default_unit: "m3",
    source: `%N, C:N, moisture: ${NRAES}; density 1.7 lb/US gal (loose): ${MST}`,
  },
  coffee_grounds: {
    code: "coffee_grounds",
    name: "Used coffee grounds",
    n_pct: 2.3,
    cn_ratio: 20,
    // Table A.1 gives 75–80 %; we take the middle.
    moisture_pct: 77.5,
    // 7 lb/gal × 119.826 = 838.8 kg/m³.
    bulk_density_kg_m3: 7 * KG_M3_PER_LB_PER_GAL,
    default_unit: "kg",
    source: `%N (about 2.3), C:N, moisture (75–80, midpoint): ${NRAES}; density 7 lb/US gal: ${MST}`,
  },
  wood_chips: {
    code: "wood_chips",
    name: "Wood chips",
    // Table A.1 gives no %N for chips. Dry plant matter is about half carbon (from memory;
    // the Table A.1 rows above work out to 46–58 % C), so %N ≈ 50 / 560 = 0.09.
    n_pct: 0.09,
    cn_ratio: 560,
    moisture_pct: 45,
    // Green chips 473 lb/yd³ × 0.593276 = 280.6 kg/m³ (dry chips: 243 lb/yd³ = 144.2 kg/m³);
    // free chips from tree crews are green.
    bulk_density_kg_m3: 473 * KG_M3_PER_LB_PER_YD3,
    default_unit: "m3",
    source:
      `C:N 560 (hardwood chips): ${NRAES}; %N derived from it assuming 50 % carbon (from memory); ` +
      "moisture 45 % for fresh chips: from memory; density 473 lb/yd³ (green): Oregon DEQ conversion factors (2005)",
  },
  manure: {
    code: "manure",
    name: "Horse manure",
    n_pct: 1.6,
    cn_ratio: 30,
    moisture_pct: 72,
    // 6.8 lb/gal × 119.826 = 814.8 kg/m³.
    bulk_density_kg_m3: 6.8 * KG_M3_PER_LB_PER_GAL,
    default_unit: "m3",
    source: `%N, C:N, moisture: ${NRAES} (horse manure); density 6.8 lb/US gal: ${MST}`,
  },
  compost: {
    code: "compost",
    name: "Finished compost",
    // Finished compost varies too much from batch to batch for one figure, and none of our
    // sources gives one: a blend with compost must carry the supplier's own analysis.
    n_pct: null,
    cn_ratio: null,
    moisture_pct: 45,
    // Middle of 1,000–1,600 lb/yd³: 1,300 × 0.593276 = 771.3 kg/m³.
    bulk_density_kg_m3: 1300 * KG_M3_PER_LB_PER_YD3,
    default_unit: "m3",
    source:
      "density 1,000–1,600 lb/yd³ (midpoint): recycling-measurement guidance, common practice; " +
      "moisture 45 %: from memory; %N and C:N: none — ask the supplier",
  },
};

/**
 * How far a load can stray from the figures above, where a source gives a spread: the first
 * soak is worked out at both ends and reported as a range. Materials missing here, and the
 * ends a source does not give, keep the table's single figure.
 */
export interface MaterialSpread {
  density_kg_m3?: readonly [number, number];
  moisture_pct?: readonly [number, number];
  source: string;
}

export const MATERIAL_SPREADS: Partial<Record<MaterialCode, MaterialSpread>> = {
  leaves: {
    // 1 lb/gal = 119.8 kg/m³ loose and dry, 2 lb/gal = 239.7 kg/m³ compacted.
    density_kg_m3: [1 * KG_M3_PER_LB_PER_GAL, 2 * KG_M3_PER_LB_PER_GAL],
    source: `density loose dry 1 to compacted 2 lb/US gal: ${MST}`,
  },
  straw: {
    // 1–3 lb/ft³ = 16.0–48.1 kg/m³.
    density_kg_m3: [1 * KG_M3_PER_LB_PER_FT3, 3 * KG_M3_PER_LB_PER_FT3],
    moisture_pct: [4, 27],
    source: `density loose 1–3 lb/ft³: biomass handling texts (common practice); moisture 4–27 %: ${NRAES}`,
  },
  grass_clippings: {
    density_kg_m3: [1.7 * KG_M3_PER_LB_PER_GAL, 3.2 * KG_M3_PER_LB_PER_GAL],
    source: `density loose 1.7 to compacted 3.2 lb/US gal: ${MST}`,
  },
  wood_chips: {
    // Dry 243 lb/yd³ = 144.2 kg/m³ to green 473 lb/yd³ = 280.6 kg/m³.
    density_kg_m3: [243 * KG_M3_PER_LB_PER_YD3, 473 * KG_M3_PER_LB_PER_YD3],
    source: "density dry 243 to green 473 lb/yd³: Oregon DEQ conversion factors (2005)",
  },
  compost: {
    density_kg_m3: [1000 * KG_M3_PER_LB_PER_YD3, 1600 * KG_M3_PER_LB_PER_YD3],
    source: "density 1,000–1,600 lb/yd³: recycling-measurement guidance, common practice",
  },
};

// ---------------------------------------------------------------------------------------
// Layer defaults and allowed ranges (common practice, no source, unless stated)
// ---------------------------------------------------------------------------------------

/** A flattened moving box, roughly (common practice, no source). */
export const DEFAULT_CARDBOARD_SHEET = { length_m: 1.0, width_m: 0.8 } as const;
/** Seams overlapped about 6 in (common practice, no source). */
export const CARDBOARD_OVERLAP_CM = { default: 15, min: 10, max: 30 } as const;
/**
 * Areal mass of single-wall corrugated board: two liners and a fluted medium come to
 * roughly 0.4–0.6 kg/m² (from memory; no published figure at hand), so 0.5.
 */
export const CARDBOARD_KG_PER_M2 = 0.5;
/** The same, as the span a load may fall in (from memory). */
export const CARDBOARD_KG_PER_M2_RANGE = [0.4, 0.6] as const;

/** Depth of each loose layer, cm. Leaves 4–6 in, straw about 2 in (common practice, no source); chips from memory. */
export const LAYER_DEPTH_CM = {
  leaves: { default: 12.5, min: 5, max: 30 },
  straw: { default: 5, min: 2, max: 15 },
  wood_chips: { default: 7.5, min: 2, max: 15 },
} as const;

/**
 * The thickest layer of each nitrogen-rich extra a sheet-mulch bed can take (common practice,
 * no source): clippings past about 3 cm (1 in) mat into a wet, airless sheet that sours;
 * coffee grounds crust over past a centimetre; rotted manure goes on as a thin layer.
 */
export const GREEN_LAYER_MAX_CM = { grass_clippings: 3, coffee_grounds: 1, manure: 3 } as const;
/** The most extra leaves or straw to suggest for a bed too rich in nitrogen, cm (common practice, no source). */
export const BROWN_LAYER_MAX_CM = { leaves: 10, straw: 5 } as const;

/** Paper lawn-and-leaf bag, 30 US gal = 0.1136 m³ = 4.01 ft³ (common practice, no source). */
export const BAG_US_GAL = 30;
export const BAG_M3 = BAG_US_GAL * US_GALLON_M3;

/** A household bucket, 10 L (common practice, no source: the usual size sold for garden and cleaning use). */
export const BUCKET_L = 10;
export const BUCKET_M3 = BUCKET_L * LITRE_M3;
/** A garden wheelbarrow's load, 80 L (common practice, no source: garden barrows hold 60–100 L; 80 L is the middle). */
export const BARROW_L = 80;
export const BARROW_M3 = BARROW_L * LITRE_M3;


// ---------------------------------------------------------------------------------------
// Targets
// ---------------------------------------------------------------------------------------

/**
 * Moisture, % wet basis: 50–60 ideal, 40–65 acceptable (The Composting Handbook, Rynk ed.,
 * 2022, Table 4.2). The squeeze test — a drop or two, no steady drip — is the same 50–60 %
 * (Cornell, Composting in the Classroom). Default target: the middle of the ideal band.
 */
export const MOISTURE_PCT = { ideal_min: 50, ideal_max: 60, min: 40, max: 65, target: 55 } as const;
/** C:N 25–40 ideal, 20–60 acceptable (The Composting Handbook, 2022, Table 4.2). */
export const CN_RATIO = { ideal_min: 25, ideal_max: 40, min: 20, max: 60 } as const;

/**
 * On build day part of the soak runs through the layers into the soil below before the mix
 * holds it: pour about a quarter again on top of what the layers take up (common practice,
 * no source). The squeeze test, not this figure, says when to stop.
 */
export const SOAK_DRAINAGE_SHARE = 0.25;

// ---------------------------------------------------------------------------------------
// Worms
// ---------------------------------------------------------------------------------------

/**
 * No published stocking density for an outdoor bed was found; this is a named, overridable
 * default. 0.5 kg/m² is about 1 lb per 10 ft², enough to seed a population that grows into
 * the food on offer (from memory / common practice, no source).
 */
export const WORM_STOCKING_KG_PER_M2 = 0.5;
/** About 1,000 worms per lb (800–1,000; common practice, no source): 1000 / 0.45359237 = 2,204.6 per kg. */
export const WORMS_PER_KG = 1000 / POUND_KG;
/**
 * Where composting worms are comfortable, °F. Virginia Cooperative Extension: best at 65–78 °F,
 * they survive 35–100 °F. Oregon State University Extension, EM 9034 "Composting with Worms":
 * most active at 55–75 °F. The care sheet gives the span of the two, 55–78 °F.
 */
export const WORM_TEMPERATURE_F = { comfortable_min: 55, comfortable_max: 78, best_min: 65, best_max: 78, survive_min: 35, survive_max: 100 } as const;
/**
 * Settled composting worms can eat about half their body weight a day: NC Cooperative
 * Extension as quoted in other guides (2 lb of worms, 1 lb of scraps a day); we have not
 * seen the original. A culture that has just moved eats much less (common practice, no source).
 */
export const WORM_DAILY_FOOD_SOURCE = "NC Cooperative Extension, as quoted in other guides; we have not seen the original";
export const WORM_DAILY_FOOD_SHARE = 0.5;

// ---------------------------------------------------------------------------------------
// Safety
// ---------------------------------------------------------------------------------------

/** NIOSH recommended weight limit under ideal conditions: 51 lb (23 kg). */
export const NIOSH_LIFT_LIMIT_KG = 23;
export const NIOSH_LIFT_LIMIT_LB = 51;

// ---------------------------------------------------------------------------------------
// Timeline
// ---------------------------------------------------------------------------------------

/** A new bed dries out or waterlogs fastest in its first weeks (common practice, no source). */
export const MOISTURE_CHECK_DAYS = [3, 7, 14, 21] as const;
/** Worms go in 7–14 days after the layers, once any heating has passed (common practice, no source). */
export const WORMS_AFTER_DAYS = { default: 10, min: 7, max: 14 } as const;
/**
 * Settling in the first months; most material transformed by month 12 (common practice, no
 * source).
 */
export const BED_MONTHS = { settling: 3, half_year: 6, ready: 12 } as const;
/**
 * When the bed can be planted into: sheet-mulched cardboard breaks down over several months
 * (Oregon State Extension), and 6–9 months before planting is the typical advice. Planting
 * into pockets of compost works earlier; the bed is mostly soil only at BED_MONTHS.ready.
 */
export const PLANT_INTO_MONTHS = { from: 6, until: 9, source: "the usual advice while the cardboard breaks down, which takes several months (Oregon State Extension)" } as const;
/**
 * How far a bed of loose leaves, straw and chips sinks: to about 60 % of the depth it was
 * built to after 3 months, half after 6, and 40 % after a year, as it settles, wets through
 * and rots (common practice, no source). Cardboard's few millimetres are left out.
 */
export const SETTLED_SHARE = { 3: 0.6, 6: 0.5, 12: 0.4 } as const;
/**
 * A seasonal top-up: a fresh 5 cm (2 in) of leaves, or 2 cm (under 1 in) of clippings,
 * thin so they do not mat (common practice, no source).
 */
export const TOP_UP_DEPTH_CM = { leaves: 5, grass_clippings: 2 } as const;
/**
 * When each top-up material is plentiful: fallen leaves in October–November (April–May
 * south of the equator), grass clippings in June–July (December–January south). Common
 * practice, no source. Each event is dated the 15th of the season's first month.
 */
export const TOP_UP_SEASONS = {
  leaves: {
    north: { month: 10, day: 15, months: "October or November" },
    south: { month: 4, day: 15, months: "April or May" },
  },
  clippings: {
    north: { month: 6, day: 15, months: "June or July" },
    south: { month: 12, day: 15, months: "December or January" },
  },
} as const;
/** A top-up within a month of building only repeats the build (common practice, no source). */
export const TOP_UP_MIN_DAYS_AFTER_BUILD = 30;

// ---------------------------------------------------------------------------------------
// Carrying material home
// ---------------------------------------------------------------------------------------

/**
 * Single-wall corrugated board is about 4 mm thick (C flute; from memory), so a flat stack
 * of it takes 4 L per m². Used only to size a car load.
 */
export const CARDBOARD_THICKNESS_M = 0.004;

/**
 * What a small car carries: a hatchback's boot holds about 300–400 L with the rear seats up,
 * and after the driver about 300 kg of payload is left (from memory). Overridable per plan.
 */
export const SMALL_CAR_LOAD = { load_l: 400, load_kg: 300 } as const;
