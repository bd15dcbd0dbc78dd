// The public listing page shows a live culture's species in its "Live culture" block, so the
// supplier's declarations beside it must be able to leave the species out: it is said once.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { QualityList } from "@/components/listings/quality-list";

const html = (props: Parameters<typeof QualityList>[0]) => renderToStaticMarkup(createElement(QualityList, props));

describe("the supplier's declarations on a listing", () => {
  it("name the worm species when nothing else on the page does", () => {
    expect(html({ material: "worms", quality: { species: "Eisenia fetida" } })).toContain("Species: Eisenia fetida");
  });

  it("leave the species out when the page shows it elsewhere", () => {
    const out = html({ material: "worms", quality: { species: "Eisenia fetida" }, omit: ["species"] });
    expect(out).not.toContain("Eisenia fetida");
  });

  it("keep every other declaration when the species is left out", () => {
    const out = html({ material: "cardboard", quality: { tape_removed: true, no_glossy_print: false }, omit: ["species"] });
    expect(out).toContain("Tape, staples and plastic removed");
    expect(out).toContain("Some glossy or coated print");
  });
});
