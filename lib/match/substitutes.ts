// What to suggest when a need cannot be covered nearby: a material that does the same job
// in the bed (a carbon-rich "brown" for a brown, a nitrogen-rich "green" for a green), in
// the same unit. Common practice, no source; the bed's blend changes, so the estimate's C:N
// advice is worth a second look after a swap.
import type { MaterialCode } from "@/lib/calc/facts";

export interface Substitute {
  material: MaterialCode;
  why: string;
}

export const SUBSTITUTES: Partial<Record<MaterialCode, Substitute[]>> = {
  straw: [
    { material: "wood_chips", why: "Wood chips make a coarser top layer that lasts longer and feeds the soil more slowly." },
    { material: "leaves", why: "More leaves do the same carbon-rich job, and mat down more." },
  ],
  leaves: [
    { material: "straw", why: "Loosened straw is the same kind of carbon-rich layer." },
    { material: "wood_chips", why: "Wood chips work as the brown layer, breaking down more slowly." },
  ],
  wood_chips: [
    { material: "straw", why: "Straw covers the same way and breaks down faster." },
    { material: "leaves", why: "Leaves do the same carbon-rich job." },
  ],
  grass_clippings: [
    { material: "coffee_grounds", why: "Coffee grounds are another nitrogen-rich green." },
    { material: "manure", why: "Well-rotted manure brings nitrogen too." },
  ],
  coffee_grounds: [{ material: "grass_clippings", why: "Fresh clippings are another nitrogen-rich green." }],
  manure: [
    { material: "compost", why: "Finished compost feeds the bed without the weed seeds." },
    { material: "grass_clippings", why: "Clippings bring nitrogen, if you can get them fresh." },
  ],
  compost: [{ material: "manure", why: "Well-rotted manure does much the same job." }],
};

/** Plain advice for needs with no listed substitute. */
export const NO_SUBSTITUTE: Partial<Record<MaterialCode, string>> = {
  cardboard: "Several layers of plain newspaper, without glossy pages, can stand in for cardboard.",
  worms: "Worms move up from the soil below a no-dig bed by themselves in time; you can also add some later.",
};
