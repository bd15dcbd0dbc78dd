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

const baleKg = (lb: number) => Math.round(lb * POUND_KG);

/** Each note once, so the bed estimate and the pickup plan say the same thing. */
export const CAUTION_NOTES = {
  // Common practice; coated board also slows water and air getting through.
  cardboard: "Pull off tape, staples and plastic first, and leave out glossy, waxed or coated board.",
  // A Wisconsin yard-waste study found lead and chromium in curb-vacuumed leaves.
  leaves:
    "Leaves vacuumed up from the kerb or roadside can bring litter and road runoff with them, lead and chromium included; leaves raked from gardens and parks are the safer pick.",
  // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
  herbicide:
    "Straw (like hay, manure and clippings) can carry weedkiller residues that survive composting and stunt vegetables. Ask the supplier what was sprayed, and grow a few beans or peas in pots of it for two or three weeks before you build.",
  bale: `A small bale weighs about ${baleKg(BALE_MASS_LB.min)}–${baleKg(BALE_MASS_LB.max)} kg (${BALE_MASS_LB.min}–${BALE_MASS_LB.max} lb), at or over the ${NIOSH_LIFT_LIMIT_KG} kg (${NIOSH_LIFT_LIMIT_LB} lb) NIOSH limit for one lift: keep it close, bend your knees, and share the lift with a second person.`,
  worms:
    "Worms are live animals, and some earthworm species are invasive in some regions. Buy from a grower who can tell you the species, and follow your local rules.",
  // General to every bed: Legionella and other microbes in soil, compost and manure (WHS Queensland).
  gloves: "Wear gloves with soil, compost and manure, dampen anything dusty, and wash your hands afterwards.",
  watering: "Check for local watering restrictions before you soak the bed.",
  defer:
    "These are general notes, not advice for your site: your local rules come first, and a licensed professional can advise where you need it.",
} as const;

export function estimateCautions(layers: CautionLayers): string[] {
  const notes: string[] = [];
  if (layers.cardboard) notes.push(CAUTION_NOTES.cardboard);
  if (layers.leaves) notes.push(CAUTION_NOTES.leaves);
  if (layers.straw) notes.push(CAUTION_NOTES.herbicide, CAUTION_NOTES.bale);
  if (layers.worms) notes.push(CAUTION_NOTES.worms);
  notes.push(CAUTION_NOTES.gloves, CAUTION_NOTES.watering, CAUTION_NOTES.defer);
  return notes;
}
