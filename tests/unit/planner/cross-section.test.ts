// The bed's cross-section: every layer of the recipe is drawn, wood chips included, bottom to
// top in the order the estimate lays them, on one vertical scale. The expected figures are the
// drawing's own geometry worked by hand (our arithmetic, no published source); the depths are
// inputs, not facts.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import tailwind from "@/tailwind.config";
import { CrossSection } from "@/components/planner/cross-section";
import { CARDBOARD_DRAW_CM, crossSectionLayout, LAYER_COLOURS, SOIL_PX } from "@/components/planner/cross-section-layout";
import { estimate } from "@/lib/calc/estimate";

const FULL = { cardboard: true, leaves: 15, straw: 10, wood_chips: 7.5 };

describe("crossSectionLayout", () => {
  it("stacks cardboard, leaves, straw and wood chips from the soil up, each band touching the next", () => {
    const { bands, soilTop } = crossSectionLayout(FULL);
    expect(bands.map((b) => b.key)).toEqual(["cardboard", "leaves", "straw", "wood_chips"]);
    expect(bands[0].y + bands[0].h).toBeCloseTo(soilTop, 9);
    for (let i = 1; i < bands.length; i++) expect(bands[i].y + bands[i].h).toBeCloseTo(bands[i - 1].y, 9);
    expect(bands[3]).toMatchObject({ label: "wood chips", cm: 7.5 });
  });

  it("draws wood chips to the same scale as the other layers", () => {
    const { bands, pxPerCm, height } = crossSectionLayout(FULL);
    // 0.5 + 15 + 10 + 7.5 = 33 cm of layers, over the 10 cm floor, so 180 px / 33 cm = 5.4545 px a cm.
    expect(pxPerCm).toBeCloseTo(180 / 33, 9);
    // Wood chips 7.5 cm × 5.4545 = 40.91 px; leaves 15 cm = 81.82 px: twice as tall, as the depths are.
    expect(bands[3].h).toBeCloseTo(40.909, 3);
    expect(bands[1].h / bands[3].h).toBeCloseTo(2, 9);
    // 180 px of layers + the soil strip + 24 px of headroom.
    expect(height).toBeCloseTo(180 + SOIL_PX + 24, 9);
    expect(bands[0].h).toBeCloseTo(CARDBOARD_DRAW_CM * pxPerCm, 9);
  });

  it("draws a thin stack at most 8 px a cm, wood chips alone included", () => {
    const { bands, pxPerCm } = crossSectionLayout({ cardboard: false, wood_chips: 7.5 });
    // 7.5 cm is under the 10 cm floor: 180 / 10 = 18 px a cm, capped at 8; 7.5 × 8 = 60 px.
    expect(pxPerCm).toBe(8);
    expect(bands).toHaveLength(1);
    expect(bands[0].h).toBe(60);
  });

  it("leaves out a layer the recipe does not have", () => {
    expect(crossSectionLayout({ cardboard: true, leaves: 12.5, straw: 5 }).bands.map((b) => b.key)).toEqual(["cardboard", "leaves", "straw"]);
  });

  it("gives wood chips the palette's own colour, not another layer's", () => {
    const colors = tailwind.theme?.extend?.colors as Record<string, Record<number, string>>;
    expect(LAYER_COLOURS.wood_chips).toBe(colors.humus[500]);
    const others = Object.entries(LAYER_COLOURS).filter(([k]) => k !== "wood_chips").map(([, v]) => v);
    expect(others).not.toContain(LAYER_COLOURS.wood_chips);
  });
});

describe("CrossSection", () => {
  it("draws and labels the wood-chip layer of an estimate that has one", () => {
    const result = estimate({ bed: { length_m: 2, width_m: 1 }, layers: { wood_chips: { depth_cm: 7.5 } } }, new Date("2026-10-01T12:00:00Z"));
    const depth = (m: string) => (result.needs.find((n) => n.material === m) as { depth_cm?: number } | undefined)?.depth_cm;
    const html = renderToStaticMarkup(
      createElement(CrossSection, { depths: { cardboard: true, leaves: depth("leaves"), straw: depth("straw"), wood_chips: depth("wood_chips") }, system: "metric" }),
    );
    expect(html).toMatch(/<g data-layer="wood_chips"><rect [^>]*fill="#84633f"/);
    expect(html).toMatch(/>wood chips<\/text>/);
    expect(html).toMatch(/<title id="xsec-title">Cross-section: cardboard [^<]*, leaves [^<]*, straw [^<]*, wood chips 7\.5 cm on the old soil<\/title>/);
  });

  it("draws no wood-chip band when the recipe has none", () => {
    const html = renderToStaticMarkup(createElement(CrossSection, { depths: { cardboard: true, leaves: 12.5, straw: 5 }, system: "metric" }));
    expect(html).not.toContain("wood_chips");
    expect(html).not.toContain("wood chips");
  });
});
