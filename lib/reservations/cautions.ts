// The short cautions shown where a gardener decides to collect a material. They name the
// hazard and step aside: local rules and licensed advice come first.
import { NIOSH_LIFT_LIMIT_KG } from "@/lib/calc/facts";
import { CAUTION_TEXT, NIOSH_LIMIT } from "@/lib/calc/cautions";
import { kgToLb, type UnitSystem } from "@/lib/calc/units";

export interface CautionInput {
  material: string;
  unit: string;
  unit_mass_kg: number | null;
  quantity?: number;
  /** How a live culture reaches the buyer: collected (the default) or posted. */
  fulfilment?: "pickup" | "post" | null;
}

export function pickupCautions(l: CautionInput, system: UnitSystem = "metric"): string[] {
  const notes: string[] = [];
  if (["straw", "manure", "grass_clippings", "compost"].includes(l.material)) {
    // NC State Extension "Herbicide Carryover"; bean/pea pot test per WSU Whatcom County Extension.
    notes.push(
      "Straw, hay, manure, clippings and compost can carry weedkiller residues that survive composting and stunt vegetables. Ask the supplier what was sprayed, and grow a few beans or peas in a pot of it before you build with it.",
    );
  }
  const heavy = l.unit === "bales" || (l.unit_mass_kg ?? 0) >= NIOSH_LIFT_LIMIT_KG;
  if (heavy) {
    const kg = l.unit_mass_kg;
    const each = kg ? `about ${system === "imperial" ? `${Math.round(kgToLb(kg))} lb` : `${Math.round(kg)} kg`} each` : "heavy";
    notes.push(
      `These are ${each}; NIOSH puts the limit for one lift at ${NIOSH_LIMIT[system]} in ideal conditions. Keep the load close, bend your knees, and lift with a second person.`,
    );
  }
  if (l.material === "leaves") {
    notes.push("Leaves swept or vacuumed from kerbs and roadsides can bring litter and road runoff with them; ask where these were raked.");
  }
  if (l.material === "cardboard") notes.push("Pull off tape, staples and plastic, and leave out glossy, waxed or coated board.");
  if (l.material === "worms") {
    const handling = l.fulfilment === "post" ? `they travel in a parcel, so ${CAUTION_TEXT.wormsPosted}` : CAUTION_TEXT.wormsCollected;
    notes.push(`Worms are live animals: ${handling}. Some earthworm species are invasive in some regions; check the species and your local rules.`);
  }
  if (["manure", "compost", "coffee_grounds", "wood_chips", "grass_clippings", "leaves"].includes(l.material)) {
    notes.push("Wear gloves, and wash your hands after handling soil, compost and manure.");
  }
  notes.push("These are general notes, not advice for your site: local rules come first, and a licensed professional can advise where you need it.");
  return notes;
}
