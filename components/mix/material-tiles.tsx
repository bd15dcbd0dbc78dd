import { MATERIAL_CODES, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";
import { isBrown } from "./balance-picture";

const COMPOSTING = MATERIAL_CODES.filter((c) => c !== "worms");

/** The materials as tiles to pick: browns first, then greens, then something of your own. */
export function MaterialTiles({ chosen, onToggle }: { chosen: (MaterialCode | undefined)[]; onToggle: (m: MaterialCode | undefined) => void }) {
  const browns = COMPOSTING.filter((m) => isBrown(MATERIALS[m].cn_ratio ?? undefined));
  const greens = COMPOSTING.filter((m) => !isBrown(MATERIALS[m].cn_ratio ?? undefined));
  const tile = (m: MaterialCode | undefined, name: string, colour: string) => {
    const on = m !== undefined && chosen.includes(m);
    return (
      <li key={m ?? "other"}>
        <button
          type="button"
          aria-pressed={m === undefined ? undefined : on}
          onClick={() => onToggle(m)}
          className={`flex min-h-14 w-full items-center gap-2 rounded-leaf px-3 py-2 text-left text-sm font-semibold ring-1 transition ${on ? "bg-moss-50 ring-2 ring-moss-600" : "bg-white ring-humus-200 hover:bg-humus-100"}`}
        >
          <span aria-hidden="true" className="h-6 w-6 shrink-0 rounded-full ring-1 ring-humus-700/30" style={{ background: colour }} />
          {name}
        </button>
      </li>
    );
  };
  return (
    <section aria-labelledby="tiles-title" className="flex flex-col gap-2">
      <h2 id="tiles-title" className="text-lg font-semibold">
        What you have
      </h2>
      <p className="text-sm text-humus-700">Browns bring carbon and keep the pile open; greens bring nitrogen and get it going. Pick each one you have.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <h3 className="mb-1 text-sm font-semibold text-humus-700">Browns</h3>
          <ul className="grid grid-cols-2 gap-2">{browns.map((m) => tile(m, MATERIALS[m].name, MATERIAL_COLOURS[m]))}</ul>
        </div>
        <div>
          <h3 className="mb-1 text-sm font-semibold text-humus-700">Greens</h3>
          <ul className="grid grid-cols-2 gap-2">
            {greens.map((m) => tile(m, MATERIALS[m].name, MATERIAL_COLOURS[m]))}
            {tile(undefined, "Something else (add)", PALETTE.humus[100])}
          </ul>
        </div>
      </div>
    </section>
  );
}
