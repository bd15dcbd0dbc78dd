import type { MaterialCode } from "../lib/calc/facts";
import { BAG_M3, BALE_M3 } from "../lib/calc/facts";
import { STREETS, TOWN } from "./town";
import { prng } from "./ids";

export interface DemoListing {
  key: string;
  owner: string;
  org?: string;
  material: MaterialCode;
  title: string;
  description: string;
  unit: "sheets" | "m2" | "bags" | "m3" | "bales" | "kg";
  unit_size: number | null;
  unit_mass_kg: number | null;
  quantity_total: number;
  price_cents: number;
  deposit_cents: number;
  max_per_reservation: number | null;
  /** Sold by the pack (live cultures): a pack's size in the listing's unit and its price. */
  pack?: { size: number; price_cents: number };
  quality: Record<string, unknown>;
  lat: number;
  lng: number;
  address: string;
  auto_accept: boolean;
  windows: { weekday: number; start: string; end: string }[];
}

type Template = Omit<DemoListing, "key" | "lat" | "lng" | "address" | "windows" | "title" | "pack"> & {
  titles: string[];
  /** The copies with this title are sold by the pack. */
  packed?: { title: string; size: number; price_cents: number };
};

const SHEET_M2 = 0.8; // a flattened large box, 1.0 × 0.8 m (common practice, no source)

const TEMPLATES: Template[] = [
  { owner: "supplier", material: "leaves", titles: ["Bagged oak and beech leaves", "Leaf bags from the back garden", "Raked lime leaves, dry"], description: "Raked from my own lawn, no street sweepings. Bags are paper and can go on the bed too.", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, quantity_total: 14, price_cents: 0, deposit_cents: 200, max_per_reservation: 10, quality: { leaf_source: "garden" }, auto_accept: false },
  { owner: "maeve", material: "leaves", titles: ["Sycamore leaves, eight bags", "Mixed leaves in paper sacks"], description: "From two big garden trees. Slightly damp, already starting to break down.", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, quantity_total: 8, price_cents: 0, deposit_cents: 0, max_per_reservation: null, quality: { leaf_source: "garden" }, auto_accept: true },
  { owner: "tobias", material: "leaves", titles: ["Leaf mould starter: shredded leaves", "Mown-up leaves, shredded"], description: "Run over with the mower so they are already shredded. Collect from the side gate.", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, quantity_total: 6, price_cents: 0, deposit_cents: 0, max_per_reservation: 6, quality: { leaf_source: "garden" }, auto_accept: true },
  { owner: "council", org: "council", material: "leaves", titles: ["Park leaf pile, load your own", "Autumn leaves from Lantern Hill park"], description: "Leaves from the park paths and lawns, kept apart from road sweepings. Bring your own bags or a trailer.", unit: "m3", unit_size: null, unit_mass_kg: null, quantity_total: 30, price_cents: 0, deposit_cents: 0, max_per_reservation: 1.5, quality: { leaf_source: "park" }, auto_accept: true },
  { owner: "cycles", material: "cardboard", titles: ["Flat bike boxes, large", "Big flat boxes every Friday", "Plain brown board, tape removed"], description: "Large plain boxes from bike deliveries. We pull the tape and staples off; no glossy print.", unit: "sheets", unit_size: SHEET_M2, unit_mass_kg: null, quantity_total: 25, price_cents: 0, deposit_cents: 0, max_per_reservation: 20, quality: { tape_removed: true, no_glossy_print: true }, auto_accept: true },
  { owner: "priya", material: "cardboard", titles: ["Moving boxes, flattened", "Cardboard after a house move"], description: "About twenty moving boxes, flattened. Some still have tape on them.", unit: "sheets", unit_size: 0.6, unit_mass_kg: null, quantity_total: 20, price_cents: 0, deposit_cents: 0, max_per_reservation: null, quality: { tape_removed: false, no_glossy_print: true }, auto_accept: false },
  { owner: "farm", material: "straw", titles: ["Wheat straw, small bales", "Spoiled straw bales (rained on)", "Barley straw, dry, small bales"], description: "Two-string small bales stored in the barn. We can tell you what the field was sprayed with.", unit: "bales", unit_size: BALE_M3, unit_mass_kg: 20, quantity_total: 40, price_cents: 450, deposit_cents: 0, max_per_reservation: 12, quality: { herbicide_history: "known_untreated" }, auto_accept: false },
  { owner: "stables", material: "straw", titles: ["Bedding straw, half bales"], description: "Clean bedding straw, never used. Sprays on the field unknown — we buy it in.", unit: "bales", unit_size: BALE_M3, unit_mass_kg: 18, quantity_total: 10, price_cents: 300, deposit_cents: 0, max_per_reservation: 5, quality: { herbicide_history: "unknown" }, auto_accept: true },
  { owner: "grower", material: "worms", titles: ["Red wiggler starter culture, 500 g", "Composting worms by the kilo"], description: "Eisenia fetida from our own beds, sold with some bedding. Pickup or posted early in the week.", unit: "kg", unit_size: null, unit_mass_kg: null, quantity_total: 8, price_cents: 3200, deposit_cents: 0, max_per_reservation: 2, packed: { title: "Red wiggler starter culture, 500 g", size: 0.5, price_cents: 1600 }, quality: { species: "Eisenia fetida" }, auto_accept: false },
  { owner: "tobias", material: "grass_clippings", titles: ["Fresh grass clippings", "Lawn clippings, no weedkiller"], description: "From a lawn that has had no weedkiller for years. Best collected the same day.", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, quantity_total: 4, price_cents: 0, deposit_cents: 0, max_per_reservation: null, quality: { herbicide_history: "known_untreated" }, auto_accept: true },
  { owner: "cafe", material: "coffee_grounds", titles: ["Used coffee grounds, daily", "Espresso grounds in tubs"], description: "Grounds from the espresso machine, collected in 10 kg tubs. Bring the tub back next time.", unit: "kg", unit_size: null, unit_mass_kg: null, quantity_total: 40, price_cents: 0, deposit_cents: 300, max_per_reservation: 20, quality: {}, auto_accept: true },
  { owner: "trees", material: "wood_chips", titles: ["Arborist wood chips, a trailer load", "Fresh chips from hedge work"], description: "Mixed hardwood chips straight from the chipper. For paths or a top layer, not for digging in.", unit: "m3", unit_size: null, unit_mass_kg: null, quantity_total: 6, price_cents: 0, deposit_cents: 500, max_per_reservation: 3, quality: {}, auto_accept: false },
  { owner: "council", org: "council", material: "wood_chips", titles: ["Depot wood chips, free"], description: "Chips from council tree work, stockpiled at the depot. Shovel and load your own.", unit: "m3", unit_size: null, unit_mass_kg: null, quantity_total: 25, price_cents: 0, deposit_cents: 0, max_per_reservation: 2, quality: {}, auto_accept: true },
  { owner: "stables", material: "manure", titles: ["Well-rotted horse manure", "Stable manure, bagged"], description: "A year old, rotted down. Bagged in feed sacks. Wormers and hay sprays: ask us.", unit: "bags", unit_size: 0.04, unit_mass_kg: null, quantity_total: 30, price_cents: 150, deposit_cents: 0, max_per_reservation: 10, quality: { herbicide_history: "unknown" }, auto_accept: true },
  { owner: "council", org: "council", material: "compost", titles: ["Green-waste compost, sieved"], description: "Compost from the town's garden-waste collection, sieved to 10 mm.", unit: "m3", unit_size: null, unit_mass_kg: null, quantity_total: 12, price_cents: 0, deposit_cents: 0, max_per_reservation: 0.5, quality: { herbicide_history: "unknown" }, auto_accept: true },
];

/** Sheets, bags and bales come whole (as the listing form insists); the rest to a tenth. */
function wholeIfCounted(unit: DemoListing["unit"], x: number): number {
  return unit === "sheets" || unit === "bags" || unit === "bales" ? Math.max(1, Math.round(x)) : Math.max(1, Math.round(x * 10) / 10);
}

/** The demo's listings: each template placed one or more times around Fernhollow. */
export function demoListings(): DemoListing[] {
  const rand = prng(20261201);
  const out: DemoListing[] = [];
  let n = 0;
  for (const t of TEMPLATES) {
    const copies = t.owner === "council" ? 2 : t.titles.length + 1;
    for (let i = 0; i < copies; i++) {
      // Scatter within about 6 km of the town centre.
      const r = 6 * Math.sqrt(rand());
      const theta = rand() * 2 * Math.PI;
      const lat = TOWN.centre.lat + (r / 111.2) * Math.cos(theta);
      const lng = TOWN.centre.lng + (r / (111.2 * Math.cos((TOWN.centre.lat * Math.PI) / 180))) * Math.sin(theta);
      const { titles, packed, ...rest } = t;
      const title = titles[i % titles.length];
      out.push({
        ...rest,
        ...(packed?.title === title ? { pack: { size: packed.size, price_cents: packed.price_cents } } : {}),
        key: `listing-${++n}`,
        title,
        quantity_total: wholeIfCounted(t.unit, t.quantity_total * (0.6 + rand() * 0.8)),
        lat: Math.round(lat * 1e6) / 1e6,
        lng: Math.round(lng * 1e6) / 1e6,
        address: `${1 + Math.floor(rand() * 90)} ${STREETS[Math.floor(rand() * STREETS.length)]}, ${TOWN.name}`,
        windows: [
          { weekday: 1 + Math.floor(rand() * 5), start: "17:00", end: "19:00" },
          { weekday: 6, start: "09:00", end: "12:00" },
        ],
      });
    }
  }
  return out;
}
