// The bed's cross-section as numbers: which layers are drawn, bottom to top in the order the
// estimate lays them (lib/calc/estimate.ts), and where each band sits in the drawing. Pure,
// so the scale can be tested without rendering.

// Nominal thickness of one layer of corrugated board, for drawing only (from memory: single
// wall board is 3–5 mm).
export const CARDBOARD_DRAW_CM = 0.5;

export type DrawnLayer = "cardboard" | "leaves" | "straw" | "wood_chips";

/** Fills from the Duffbank palette (tailwind.config.ts), the same per material as the report charts. */
export const LAYER_COLOURS: Record<DrawnLayer | "soil", string> = {
  cardboard: "#a27f58", // humus-400
  leaves: "#d9962b", // litter-500
  straw: "#f0c36b", // litter-300
  wood_chips: "#84633f", // humus-500
  soil: "#523c27", // humus-700
};
/** Text inside a band: dark on the light fills, light on the dark ones, for contrast. */
export const LAYER_TEXT: Record<DrawnLayer, string> = { cardboard: "#271c13", leaves: "#271c13", straw: "#271c13", wood_chips: "#f7f3ee" };
export const LAYER_LABELS: Record<DrawnLayer, string> = { cardboard: "cardboard", leaves: "leaves", straw: "straw", wood_chips: "wood chips" };

export interface LayerDepths {
  cardboard: boolean;
  leaves?: number;
  straw?: number;
  wood_chips?: number;
}

export interface Band {
  key: DrawnLayer;
  label: string;
  cm: number;
  y: number;
  h: number;
}

export const SOIL_PX = 36;
const MIN_BAND_PX = 2;

export function crossSectionLayout(depths: LayerDepths): { layers: { key: DrawnLayer; label: string; cm: number }[]; pxPerCm: number; height: number; soilTop: number; bands: Band[] } {
  const cms: [DrawnLayer, number | undefined][] = [
    ["cardboard", depths.cardboard ? CARDBOARD_DRAW_CM : undefined],
    ["leaves", depths.leaves],
    ["straw", depths.straw],
    ["wood_chips", depths.wood_chips],
  ];
  const layers = cms.filter((l): l is [DrawnLayer, number] => !!l[1] && l[1] > 0).map(([key, cm]) => ({ key, label: LAYER_LABELS[key], cm }));
  const total = layers.reduce((s, l) => s + l.cm, 0);
  // At most 8 px a centimetre, and the whole stack within 180 px, on one scale for every band.
  const pxPerCm = Math.min(8, 180 / Math.max(total, 10));
  const height = total * pxPerCm + SOIL_PX + 24;
  const soilTop = height - SOIL_PX;
  let y = soilTop;
  const bands = layers.map((l) => {
    const h = Math.max(l.cm * pxPerCm, MIN_BAND_PX);
    y -= h;
    return { ...l, y, h };
  });
  return { layers, pxPerCm, height, soilTop, bands };
}
