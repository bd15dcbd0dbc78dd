// Short safety notes for the layers chosen. They point at real hazards and then step aside:
// local rules and licensed advice outrank anything written here.
import { BALE_MASS_LB, NIOSH_LIFT_LIMIT_KG, NIOSH_LIFT_LIMIT_LB, POUND_KG, type MaterialCode } from "./facts";
import type { UnitSystem } from "./units";

export interface CautionLayers {
  cardboard: boolean;
  leaves: boolean;
  straw: boolean;
  wood_chips: boolean;
  worms: boolean;
}

const baleKg = (lb: number) => Math.round(lb * POUND_KG);

// Weights in the reader's units: metric readers get kilograms with pounds beside them (the
// limit is published in pounds); imperial readers get pounds alone.
export const NIOSH_LIMIT: Record<UnitSystem, string> = {
  metric: `${NIOSH_LIFT_LIMIT_KG} kg (${NIOSH_LIFT_LIMIT_LB} lb)`,
  imperial: `${NIOSH_LIFT_LIMIT_LB} lb`,
};
const weighs = (kg: number, system: UnitSystem) => (system === "imperial" ? `${Math.round(kg / POUND_KG)} lb` : `${Math.round(kg)} kg (${Math.round(kg / POUND_KG)} lb)`);

/** What a small bale weighs and how to lift it. */
export function smallBaleText(system: UnitSystem): string {
  const range = system === "imperial" ? `${BALE_MASS_LB.min}–${BALE_MASS_LB.max} lb` : `${baleKg(BALE_MASS_LB.min)}–${baleKg(BALE_MASS_LB.max)} kg (${BALE_MASS_LB.min}–${BALE_MASS_LB.max} lb)`;
  return `A small bale weighs about ${range}; the heavier ones are over the ${NIOSH_LIMIT[system]} NIOSH recommends for one lift in ideal conditions, and all of them are awkward: keep it close, bend your knees, and share the lift with a second person.`;
}

// The words of each caution, shared by the bed estimate and the listing pages.
export const CAUTION_TEXT = {
  // Common practice; coated board also slows water and air getting through.
  cardboard: "Pull off tape, staples and plastic first, and leave out glossy, waxed or coated board.",
  // A Wisconsin yard-waste study found lead and chromium in curb-vacuumed leaves.
  roadsideLeaves:
    "Leaves vacuumed up from the kerb or roadside can bring litter and road runoff with them, lead and chromium included; leaves raked from gardens and parks are the safer pick.",
  // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
  herbicide:
    "Straw (like hay, manure and clippings) can carry weedkiller residues that survive composting and stunt vegetables. Ask the supplier what was sprayed, and grow a few beans or peas in pots of it for two or three weeks before you build.",
  // NIOSH's limit sits inside the usual range: the lighter bales are under it, the heavier over.
  smallBale: smallBaleText("metric"),
  worms:
    "Worms are live animals, and some earthworm species are invasive in some regions. Buy from a grower who can tell you the species, and follow your local rules.",
  // How live worms travel, by the way they reach the buyer (common practice, no source).
  wormsCollected: "bring a container with damp bedding, keep it out of the sun and the cold, and go straight home",
  wormsPosted: "be in when the parcel is due, open it as soon as it comes, and move the worms into damp bedding out of the sun and the cold",
  // General to every bed: Legionella and other microbes in soil, compost and manure (WHS Queensland).
  gloves: "Wear gloves with soil, compost and manure, dampen anything dusty, and wash your hands afterwards.",
  watering: "Check for local watering restrictions before you soak the bed.",
  defer:
    "These are general notes, not advice for your site: your local rules come first, and a licensed professional can advise where you need it.",
} as const;

export function estimateCautions(layers: CautionLayers, system: UnitSystem = "metric"): string[] {
  const notes: string[] = [];
  if (layers.cardboard) notes.push(CAUTION_TEXT.cardboard);
  if (layers.leaves) notes.push(CAUTION_TEXT.roadsideLeaves);
  if (layers.straw) notes.push(CAUTION_TEXT.herbicide, smallBaleText(system));
  if (layers.worms) notes.push(CAUTION_TEXT.worms);
  notes.push(CAUTION_TEXT.gloves, CAUTION_TEXT.watering, CAUTION_TEXT.defer);
  return notes;
}

export interface ListingCaution {
  kind: "cardboard" | "roadside" | "herbicide" | "lifting" | "worms" | "gloves" | "defer";
  text: string;
}

export interface ListingCautionInput {
  material: MaterialCode;
  unit: string;
  unit_mass_kg: number | null;
  quality: {
    tape_removed?: boolean;
    no_glossy_print?: boolean;
    herbicide_history?: string;
    leaf_source?: string;
    species?: string;
    /** A live culture's ways of reaching the buyer; each is offered unless set to false. */
    ships?: boolean;
    pickup?: boolean;
  };
}

const MATERIAL_WORD: Partial<Record<MaterialCode, string>> = {
  straw: "Straw",
  manure: "Manure",
  grass_clippings: "Grass clippings",
  compost: "Compost",
};

/**
 * The cautions a listing's page shows beside the material, from what it is and what its
 * supplier declared. Sources as in CAUTION_TEXT; herbicide carryover (NC State Extension,
 * UF/IFAS SS-AGR-415) and the bean or pea pot test (WSU Whatcom County Extension).
 */
export function listingCautions(l: ListingCautionInput, system: UnitSystem = "metric"): ListingCaution[] {
  const out: ListingCaution[] = [];
  const q = l.quality;
  if (l.material === "cardboard") {
    const said = q.tape_removed === false || q.no_glossy_print === false ? " The supplier says some of it still has tape or glossy print." : "";
    out.push({ kind: "cardboard", text: CAUTION_TEXT.cardboard + said });
  }
  if (l.material === "leaves") {
    const said = q.leaf_source === "roadside" ? " The supplier says these came from a street or roadside." : "";
    out.push({ kind: "roadside", text: CAUTION_TEXT.roadsideLeaves + said });
  }
  const word = MATERIAL_WORD[l.material];
  if (word) {
    const said =
      q.herbicide_history === "known_untreated"
        ? " The supplier says it is known to be unsprayed."
        : " The supplier does not know what was sprayed.";
    out.push({
      kind: "herbicide",
      text:
        `${word} can carry weedkiller residues (aminopyralid, clopyralid and similar) that survive composting and stunt beans, peas, tomatoes and potatoes.` +
        `${said} Before you build, grow a few beans or peas in pots of it beside pots of plain compost for two or three weeks and compare.`,
    });
  }
  if (l.unit === "bales") {
    const kg = l.unit_mass_kg;
    out.push({
      kind: "lifting",
      text:
        kg == null
          ? smallBaleText(system)
          : kg > NIOSH_LIFT_LIMIT_KG
            ? `Each bale weighs about ${weighs(kg, system)}, over the ${NIOSH_LIMIT[system]} NIOSH limit for one lift: keep it close, bend your knees, and share the lift with a second person.`
            : `Each bale weighs about ${weighs(kg, system)}, under the ${NIOSH_LIMIT[system]} NIOSH limit for one lift in ideal conditions: still keep it close and bend your knees.`,
    });
  }
  if (l.material === "worms") {
    const collected = q.pickup !== false;
    const posted = q.ships !== false;
    const handling =
      collected && posted
        ? ` If you collect them, ${CAUTION_TEXT.wormsCollected}; if they are posted, ${CAUTION_TEXT.wormsPosted}.`
        : posted
          ? ` They come by post: ${CAUTION_TEXT.wormsPosted}.`
          : ` They are collected from the grower: ${CAUTION_TEXT.wormsCollected}.`;
    out.push({ kind: "worms", text: `${q.species ? `The grower names the species as ${q.species}. ` : ""}${CAUTION_TEXT.worms}${handling}` });
  }
  if (l.material !== "cardboard") out.push({ kind: "gloves", text: CAUTION_TEXT.gloves });
  out.push({ kind: "defer", text: CAUTION_TEXT.defer });
  return out;
}

/** What a household collecting from a council giveaway day should know about the material. */
export function giveawayCautions(material: string): string[] {
  const notes: string[] = [];
  if (material === "leaves") notes.push(CAUTION_TEXT.roadsideLeaves);
  if (material === "compost") {
    // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
    notes.push(
      "Compost made from garden waste can carry weedkiller residues that survive composting. Ask staff about the source, and try a few beans or peas in a pot of it before filling a whole bed.",
    );
  }
  if (material === "wood_chips") notes.push("Fresh chips suit paths and the top of a bed; dug in, they hold back nitrogen while they rot (common practice).");
  notes.push(CAUTION_TEXT.gloves);
  notes.push(CAUTION_TEXT.defer);
  return notes;
}
