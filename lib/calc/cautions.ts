// Short safety notes for the layers chosen. They point at real hazards and then step aside:
// local rules and licensed advice outrank anything written here.
import { BALE_MASS_LB, NIOSH_LIFT_LIMIT_KG, NIOSH_LIFT_LIMIT_LB, POUND_KG } from "./facts";

export interface CautionLayers {
  cardboard: boolean;
  leaves: boolean;
  straw: boolean;
  wood_chips: boolean;
  worms: boolean;
}

// A Wisconsin yard-waste study found lead and chromium in curb-vacuumed leaves.
const ROADSIDE_LEAVES =
  "Leaves vacuumed up from the kerb or roadside can bring litter and road runoff with them, lead and chromium included; leaves raked from gardens and parks are the safer pick.";
// Legionella and other microbes in soil, compost and manure (WHS Queensland).
const GLOVES = "Wear gloves with soil, compost and manure, dampen anything dusty, and wash your hands afterwards.";
const LOCAL_RULES_FIRST =
  "These are general notes, not advice for your site: your local rules come first, and a licensed professional can advise where you need it.";

const baleKg = (lb: number) => Math.round(lb * POUND_KG);

export function estimateCautions(layers: CautionLayers): string[] {
  const notes: string[] = [];
  if (layers.cardboard) {
    // Common practice; coated board also slows water and air getting through.
    notes.push("Pull off tape, staples and plastic first, and leave out glossy, waxed or coated board.");
  }
  if (layers.leaves) {
    notes.push(ROADSIDE_LEAVES);
  }
  if (layers.straw) {
    // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
    notes.push(
      "Straw (like hay, manure and clippings) can carry weedkiller residues that survive composting and stunt vegetables. Ask the supplier what was sprayed, and grow a few beans or peas in pots of it for two or three weeks before you build.",
    );
    notes.push(
      `A small bale weighs about ${baleKg(BALE_MASS_LB.min)}–${baleKg(BALE_MASS_LB.max)} kg (${BALE_MASS_LB.min}–${BALE_MASS_LB.max} lb), at or over the ${NIOSH_LIFT_LIMIT_KG} kg (${NIOSH_LIFT_LIMIT_LB} lb) NIOSH limit for one lift: keep it close, bend your knees, and share the lift with a second person.`,
    );
  }
  if (layers.worms) {
    notes.push(
      "Worms are live animals, and some earthworm species are invasive in some regions. Buy from a grower who can tell you the species, and follow your local rules.",
    );
  }
  // General to every bed.
  notes.push(GLOVES);
  notes.push("Check for local watering restrictions before you soak the bed.");
  notes.push(LOCAL_RULES_FIRST);
  return notes;
}

/** What a household collecting from a council giveaway day should know about the material. */
export function giveawayCautions(material: string): string[] {
  const notes: string[] = [];
  if (material === "leaves") notes.push(ROADSIDE_LEAVES);
  if (material === "compost") {
    // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
    notes.push(
      "Compost made from garden waste can carry weedkiller residues that survive composting. Ask staff about the source, and try a few beans or peas in a pot of it before filling a whole bed.",
    );
  }
  if (material === "wood_chips") notes.push("Fresh chips suit paths and the top of a bed; dug in, they hold back nitrogen while they rot (common practice).");
  notes.push(GLOVES);
  notes.push(LOCAL_RULES_FIRST);
  return notes;
}
