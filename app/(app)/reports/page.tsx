import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { diversionReport } from "@/lib/services/figures/report-diversion";
import { diversionScopeOf } from "@/lib/figures/diversion-scope";
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { longDate } from "@/lib/time/zoned";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { DiversionChart } from "@/components/reports/diversion-chart";
import type { ChartSeries } from "@/components/reports/chart-summary";
import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";
import { formatKg, formatM3, reportUnits } from "@/components/reports/format";
import { viewerUnits } from "@/lib/units/viewer";
import { POUND_KG } from "@/lib/calc/facts";
import { yd3ToM3 } from "@/lib/calc/units";
import { Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "What I've passed on" };
export const dynamic = "force-dynamic";

const monthLabel = (m: string) => new Intl.DateTimeFormat("en-GB", { month: "short", year: "2-digit", timeZone: "UTC" }).format(new Date(`${m}-15T00:00:00Z`));

export default async function ReportsPage() {
  const user = await pageUser("/reports", LISTING_ROLES);
  const report = await diversionReport(diversionScopeOf(user));
  const system = await viewerUnits(user);
  const u = reportUnits(system);
  // A bulk density in the reader's units: kg/m³, or lb/yd³ (1 yd³ = 0.764554857984 m³, 1 lb = 0.45359237 kg, NIST HB44).
  const density = (kgM3: number) => (system === "imperial" ? `${((kgM3 * yd3ToM3(1)) / POUND_KG).toFixed(1)} lb/yd³` : `${kgM3.toFixed(1)} kg/m³`);
  const isCouncil = !!user.organisation && user.roles.includes("council");
  const series: ChartSeries[] = report.by_material.map((m) => ({ key: m.material, label: MATERIALS[m.material as MaterialCode]?.name ?? m.material, color: MATERIAL_COLOURS[m.material] ?? PALETTE.humus[500] }));
  const months = [...new Set(report.by_month.map((m) => m.month))];
  const monthColumns = (figure: "kg" | "m3") =>
    months.map((month) => ({
      label: monthLabel(month),
      values: Object.fromEntries(report.by_month.filter((m) => m.month === month).map((m) => [m.material, figure === "kg" ? u.fromKg(m.kg) : u.fromM3(m.m3)])),
    }));
  const days = report.by_day.slice().reverse();
  return (
    <div className="flex flex-col gap-6">
      <PageHeading
        title="What I've passed on"
        lead={`Material that left ${isCouncil ? `${user.organisation!.name}'s` : "your"} hands and went into beds instead of the bin: collected reservations${isCouncil ? " and households checked in at giveaway days" : ""}.`}
      />
      {report.collections === 0 ? (
        <EmptyState title="Nothing collected yet">Once a gardener collects from one of your listings{isCouncil ? ", or a household is checked in at a giveaway day" : ""}, the figures appear here.</EmptyState>
      ) : (
        <>
          <section aria-labelledby="total-title" className="grid gap-4 sm:grid-cols-3">
            <h2 id="total-title" className="sr-only">
              Totals
            </h2>
            <Stat label="Kept from disposal" value={formatKg(report.total_kg, system)} />
            <Stat label="Volume" value={formatM3(report.total_m3, system)} />
            <Stat label="Households served" value={String(report.households)} />
          </section>
          <Panel id="month" title="By month and material" action={<a href="/api/reports/diversion.csv" className={buttonClass("secondary")}>Download CSV</a>}>
            <div className="grid gap-6 lg:grid-cols-2">
              <DiversionChart id="by-month-kg" title={`${u.massWord} passed on each month, by material`} unit={u.mass} columns={monthColumns("kg")} series={series} />
              <DiversionChart id="by-month-m3" title={`${u.volumeWord} passed on each month, by material`} unit={u.volume} columns={monthColumns("m3")} series={series} />
            </div>
            <table className="mt-4 w-full text-left text-sm">
              <caption className="sr-only">The figures in the chart</caption>
              <thead className="bg-humus-100">
                <tr>
                  <th scope="col" className="p-2">Month</th>
                  <th scope="col" className="p-2">Material</th>
                  <th scope="col" className="p-2">{u.mass}</th>
                  <th scope="col" className="p-2">{u.volume}</th>
                  <th scope="col" className="p-2">Households</th>
                </tr>
              </thead>
              <tbody>
                {report.by_month.map((m) => (
                  <tr key={`${m.month}-${m.material}`} className="border-t border-humus-100">
                    <td className="p-2">{m.month}</td>
                    <td className="p-2">{MATERIALS[m.material]?.name ?? m.material}</td>
                    <td className="p-2">{u.fromKg(m.kg).toFixed(1)}</td>
                    <td className="p-2">{u.fromM3(m.m3).toFixed(3)}</td>
                    <td className="p-2">{m.households}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Panel>
          {isCouncil ? (
            <Panel id="day" title="By giveaway day" action={<a href="/api/reports/diversion.csv?by=day" className={buttonClass("secondary")}>Download CSV by day</a>}>
              {report.by_day.length ? (
                <>
                  <div className="grid gap-6 lg:grid-cols-2">
                    <DiversionChart id="by-day-kg" title={`${u.massWord} collected at each giveaway day`} unit={u.mass} columns={days.map((d) => ({ label: d.date.slice(5), values: { [d.material]: u.fromKg(d.kg) } }))} series={series} />
                    <DiversionChart id="by-day-m3" title={`${u.volumeWord} collected at each giveaway day`} unit={u.volume} columns={days.map((d) => ({ label: d.date.slice(5), values: { [d.material]: u.fromM3(d.m3) } }))} series={series} />
                  </div>
                  <ul className="mt-2 text-sm">
                    {report.by_day.map((d) => (
                      <li key={d.day_id}>
                        {longDate(d.date)}, {d.title}: {formatKg(d.kg, system)} to {d.households} households, {formatM3(d.m3, system)}
                      </li>
                    ))}
                  </ul>
                </>
              ) : (
                <p className="text-humus-700">No households checked in at a giveaway day yet.</p>
              )}
            </Panel>
          ) : null}
          <section aria-labelledby="src-title" className="text-sm text-humus-700">
            <h2 id="src-title" className="font-semibold text-humus-900">
              Where the {u.massWord.toLowerCase()} come from
            </h2>
            <p>Quantities are converted with each material&apos;s bulk density (bags and bales by their stated size), so the masses are estimates:</p>
            <ul className="list-disc pl-5">
              {report.densities.map((d) => (
                <li key={d.material}>
                  {MATERIALS[d.material].name}: {density(d.bulk_density_kg_m3)} — {d.source}
                </li>
              ))}
            </ul>
          </section>
        </>
      )}
    </div>
  );
}

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <p className="text-sm text-humus-700">{label}</p>
      <p className="text-2xl font-bold">{value}</p>
    </div>
  );
}
