import type { MaterialCode } from "@/lib/calc/facts";
import { HERBICIDE_MATERIALS, type QualityInput } from "@/lib/validation/listings";

const yesNo = (v: boolean | undefined, yes: string, no: string) => (v === undefined ? null : v ? yes : no);

/**
 * The supplier's own declarations about the material, in plain words. `omit` leaves out
 * what the page already shows elsewhere (a live culture's species is in its own block).
 */
export function QualityList({ material, quality, omit = [] }: { material: MaterialCode; quality: QualityInput; omit?: (keyof QualityInput)[] }) {
  const lines: string[] = [];
  if (material === "cardboard") {
    const tape = yesNo(quality.tape_removed, "Tape, staples and plastic removed", "Some tape or staples still on");
    const gloss = yesNo(quality.no_glossy_print, "No glossy or coated print", "Some glossy or coated print");
    if (tape) lines.push(tape);
    if (gloss) lines.push(gloss);
  }
  if (material === "leaves" && quality.leaf_source) {
    lines.push(
      { garden: "Raked from gardens or a lawn", park: "From a park, kept apart from street sweepings", roadside: "Swept or vacuumed from a street or roadside" }[quality.leaf_source],
    );
  }
  if (HERBICIDE_MATERIALS.includes(material) && quality.herbicide_history) {
    lines.push(quality.herbicide_history === "known_untreated" ? "Supplier says: no persistent weedkiller used" : "Supplier does not know what was sprayed");
  }
  if (material === "worms" && quality.species && !omit.includes("species")) lines.push(`Species: ${quality.species}`);
  if (lines.length === 0) return null;
  return (
    <section aria-labelledby="quality-title" className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <h2 id="quality-title" className="font-semibold">What the supplier declares</h2>
      <ul className="mt-1 list-disc pl-5">
        {lines.map((l) => (
          <li key={l}>{l}</li>
        ))}
      </ul>
    </section>
  );
}
