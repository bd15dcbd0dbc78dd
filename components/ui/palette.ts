import tailwind from "@/tailwind.config";

// The palette as values, for what is drawn in code (SVG fills, chart series) rather than
// styled with classes. tailwind.config.ts stays the one place the colours are written.
type Shades = Record<number, string>;
export const PALETTE = tailwind.theme!.extend!.colors as { humus: Shades; moss: Shades; litter: Shades; ember: Shades };

/** One colour per material, the same in the bed cross-section and the report charts. */
export const MATERIAL_COLOURS: Record<string, string> = {
  leaves: PALETTE.litter[500],
  straw: PALETTE.litter[300],
  cardboard: PALETTE.humus[400],
  worms: PALETTE.ember[600],
  grass_clippings: PALETTE.moss[400],
  coffee_grounds: PALETTE.humus[800],
  wood_chips: PALETTE.humus[500],
  manure: PALETTE.humus[700],
  compost: PALETTE.moss[700],
};
