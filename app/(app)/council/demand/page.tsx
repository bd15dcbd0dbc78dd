import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { MATERIAL_CODES, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun } from "@/lib/match/format";
import { councilOf } from "@/lib/auth/council-access";
import { councilDemand } from "@/lib/services/needs/council-demand";
import { localNamesFor } from "@/lib/services/places/name-points-locally";
import { longDate } from "@/lib/time/zoned";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Panel } from "@/components/ui/panel";
import { DemandMap } from "@/components/council/demand-map";

export const metadata: Metadata = { title: "Where residents need material" };
export const dynamic = "force-dynamic";

export default async function CouncilDemandPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await pageUser("/council/demand", ["council"]);
  if (!user.organisation || user.organisation.kind !== "council") {
    return <EmptyState title="Your account is not linked to a council yet">Ask a colleague who owns your council&apos;s account to invite you.</EmptyState>;
  }
  const asked = (await searchParams).material;
  const material = (MATERIAL_CODES as readonly string[]).includes(String(asked)) ? (asked as MaterialCode) : "leaves";
  const d = await councilDemand(councilOf(user), { material });
  const system = user.unit_system;
  const names = await localNamesFor(d.cells.map((c) => c.centre));
  const most = Math.max(1, ...d.cells.map((c) => c.people));
  const s = d.suggestion;
  const plan = s
    ? `/council/giveaways/new?${new URLSearchParams({ material: s.material, date: s.date, lat: String(s.place.lat), lng: String(s.place.lng), slots: String(s.slots), capacity: String(s.slot_households) })}`
    : null;

  return (
    <div className="flex flex-col gap-6">
      <p className="text-sm">
        <Link href="/council" className="text-moss-700 underline underline-offset-4">
          ← Council desk
        </Link>
      </p>
      <PageHeading
        title="Where residents need material"
        lead={`Open needs within ${formatQuantity(d.radius_km, "km", system)} of your last giveaway site, counted by area. An area is at least ${formatQuantity(d.cell_min_area_km2, "km2", system)} and shows only once ${d.min_people} or more different people need the material there, so no household can be picked out.`}
      />

      <nav aria-label="Material" className="flex flex-wrap gap-2">
        {d.materials
          .filter((m) => m.people > 0 || m.material === material)
          .map((m) => (
            <Link
              key={m.material}
              href={`/council/demand?material=${m.material}`}
              aria-current={m.material === material ? "page" : undefined}
              className={`rounded-full px-3 py-1.5 text-sm font-medium ring-1 ${m.material === material ? "bg-moss-600 text-white ring-moss-600" : "bg-white ring-humus-300 hover:bg-humus-100"}`}
            >
              {MATERIALS[m.material].name} {m.people > 0 ? `(${m.people})` : ""}
            </Link>
          ))}
      </nav>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1.4fr)_minmax(0,1fr)]">
        <DemandMap
          centre={d.centre}
          areas={d.cells.map((c) => ({ id: c.id, south: c.south, west: c.west, north: c.north, east: c.east, intensity: c.people / most, label: `${c.people} people, ${formatQuantity(c.quantity, c.unit, system)}` }))}
          suggestion={s ? { ...s.place, label: `Suggested giveaway day, ${longDate(s.date)}` } : null}
          minPeople={d.min_people}
        />
        <Panel
          id="suggestion"
          title="A giveaway day that would fit"
          action={
            <a href={`/api/council/demand.csv?material=${material}`} className="font-semibold text-moss-700 underline underline-offset-4" download>
              Export CSV
            </a>
          }
        >
          {s ? (
            <div className="flex flex-col gap-3" data-suggestion>
              <p>
                <strong>{longDate(s.date)}</strong>, at the marked spot (within {formatQuantity(s.catchment_km, "km", system)} of the busiest area): <strong>{s.households} households</strong> still need {materialNoun(s.material)} on that day,
                about {formatQuantity(s.quantity, s.unit, system)} in all. That fills <strong>{s.slots} {s.slots === 1 ? "slot" : "slots"}</strong> of {s.slot_households} households.
              </p>
              <p className="text-sm text-humus-600">The latest Saturday, at least two weeks out, that still comes before three in four of their “needed by” dates.</p>
              {plan ? (
                <Link href={plan} className={buttonClass("primary", "self-start")}>
                  Plan this day
                </Link>
              ) : null}
            </div>
          ) : (
            <p className="text-humus-700">
              {["leaves", "wood_chips", "compost"].includes(material)
                ? `Not enough households need ${materialNoun(material)} in one area yet to suggest a day.`
                : "Giveaway days are for leaves, wood chips and compost."}
            </p>
          )}
        </Panel>
      </div>

      <Panel id="cells" title={`${MATERIALS[material].name}: areas with open needs`}>
        {d.cells.length ? (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Open needs by area</caption>
              <thead className="bg-humus-100">
                <tr>
                  <th scope="col" className="p-2">Area (centre)</th>
                  <th scope="col" className="p-2">People</th>
                  <th scope="col" className="p-2">Open needs</th>
                  <th scope="col" className="p-2">In all</th>
                </tr>
              </thead>
              <tbody>
                {d.cells.map((c, i) => (
                  <tr key={c.id} className="border-t border-humus-100">
                    <td className="p-2">
                      {names[i] ? <>Near {names[i]} </> : null}
                      <span className={names[i] ? "text-humus-600" : undefined}>
                        ({c.centre.lat.toFixed(3)}, {c.centre.lng.toFixed(3)}; {formatQuantity(c.area_km2, "km2", system)})
                      </span>
                    </td>
                    <td className="p-2">{c.people}</td>
                    <td className="p-2">{c.needs}</td>
                    <td className="p-2">{formatQuantity(c.quantity, c.unit, system)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : (
          <p className="text-humus-700">No area has {d.min_people} or more people needing {materialNoun(material)} yet.</p>
        )}
      </Panel>
    </div>
  );
}
