import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";

// The bed's cross-section as numbers: which layers are drawn, bottom to top in the order the
// estimate lays them (lib/calc/estimate.ts), and where each band sits in the drawing. Pure,
// so the scale can be tested without rendering.

// Nominal thickness of one layer of corrugated board, for drawing only (from memory: single
// wall board is 3–5 mm).
export const CARDBOARD_DRAW_CM = 0.5;

export type DrawnLayer = "cardboard" | "leaves" | "straw" | "wood_chips";

/** Fills from the Duffbank palette, the same per material as the report charts. */
export const LAYER_COLOURS: Record<DrawnLayer | "soil", string> = {
  cardboard: MATERIAL_COLOURS.cardboard,
  leaves: MATERIAL_COLOURS.leaves,
  straw: MATERIAL_COLOURS.straw,
  wood_chips: MATERIAL_COLOURS.wood_chips,
  soil: PALETTE.humus[700],
};
/** Text inside a band: dark on the light fills, light on the dark ones, for contrast. */
export const LAYER_TEXT: Record<DrawnLayer, string> = { cardboard: PALETTE.humus[900], leaves: PALETTE.humus[900], straw: PALETTE.humus[900], wood_chips: PALETTE.humus[50] };
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
