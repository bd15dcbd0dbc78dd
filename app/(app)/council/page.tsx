import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listMembers } from "@/lib/services/council/list-members";
import { councilOf } from "@/lib/auth/council-access";
import { councilDays } from "@/lib/services/giveaways/list-council-days";
import { listInvites } from "@/lib/services/council/list-invites";
import { diversionReport } from "@/lib/services/figures/report-diversion";
import { diversionScopeOf } from "@/lib/figures/diversion-scope";
import { localDate, longDate } from "@/lib/time/zoned";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { StaffPanel } from "@/components/council/staff-panel";
import { DaysTable } from "@/components/council/days-table";
import { formatKg, formatM3 } from "@/components/reports/format";
import { viewerUnits } from "@/lib/units/viewer";
import { Panel } from "@/components/ui/panel";
import { councilDemand } from "@/lib/services/needs/council-demand";
import { SUGGESTED_MATERIALS } from "@/lib/needs/demand";
import { MATERIALS } from "@/lib/calc/facts";
import { materialNoun } from "@/lib/match/format";

export const metadata: Metadata = { title: "Council desk" };
export const dynamic = "force-dynamic";

export default async function CouncilPage() {
  const user = await pageUser("/council", ["council"]);
  if (!user.organisation || user.organisation.kind !== "council") {
    return <EmptyState title="Your account is not linked to a council yet">Ask a colleague who owns your council&apos;s account to invite you.</EmptyState>;
  }
  const staff = councilOf(user);
  const system = await viewerUnits(user);
  const [members, invites, days, report, demand] = await Promise.all([
    listMembers(staff.organisationId),
    listInvites(staff),
    councilDays(staff),
    diversionReport(diversionScopeOf(user)),
    councilDemand(staff, { material: "leaves" }),
  ]);
  const waiting = demand.materials.filter((m) => (SUGGESTED_MATERIALS as readonly string[]).includes(m.material));
  const today = localDate(new Date(), "Europe/London");
  const upcoming = days.filter((d) => d.date >= today).reverse();
  const past = days.filter((d) => d.date < today);
  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeading title={staff.organisationName} lead="Giveaway days, the day's list and what your residents kept out of the bin." />
        <Link href="/council/giveaways/new" className={buttonClass("primary")}>
          New giveaway day
        </Link>
      </div>

      <Panel id="days" title="Giveaway days">
        {upcoming.length ? (
          <DaysTable days={upcoming} caption="Coming up" />
        ) : (
          <p className="text-humus-700">
            Nothing planned yet. <Link href="/council/giveaways/new" className="font-semibold text-moss-700 underline">Plan a leaf, chip or compost day</Link>.
          </p>
        )}
        {past.length ? (
          <details className="mt-4">
            <summary className="cursor-pointer font-medium">Past days ({past.length})</summary>
            <DaysTable days={past} caption="Past days" />
          </details>
        ) : null}
      </Panel>

      <Panel id="demand" title="Who is waiting for material" action={<Link href="/council/demand" className="font-semibold text-moss-700 underline underline-offset-4">Demand map and CSV</Link>}>
        <ul className="flex flex-wrap gap-x-6 gap-y-1">
          {waiting.map((m) => (
            <li key={m.material}>
              <strong>{MATERIALS[m.material].name}:</strong> {m.people ? `${m.people} people in ${m.cells} ${m.cells === 1 ? "area" : "areas"}` : "no area with three or more people yet"}
            </li>
          ))}
        </ul>
        {demand.suggestion ? (
          <p className="mt-2">
            A leaf day on <strong>{longDate(demand.suggestion.date)}</strong> would serve {demand.suggestion.households} households who need {materialNoun("leaves")} by then, in {demand.suggestion.slots}{" "}
            {demand.suggestion.slots === 1 ? "slot" : "slots"}.{" "}
            <Link href="/council/demand?material=leaves" className="font-semibold text-moss-700 underline underline-offset-4">
              See where
            </Link>
          </p>
        ) : null}
      </Panel>

      <Panel id="kept" title="Kept out of the bin" action={<Link href="/reports" className="font-semibold text-moss-700 underline underline-offset-4">Charts and CSV</Link>}>
        <p>
          <strong className="text-2xl">{formatKg(report.total_kg, system)}</strong> collected by <strong>{report.households}</strong>{" "}
          {report.households === 1 ? "household" : "households"}, from your listings and checked-in giveaway bookings.
        </p>
        {report.by_day.length ? (
          <table className="mt-3 w-full text-left text-sm">
            <caption className="sr-only">By giveaway day</caption>
            <thead className="bg-humus-100">
              <tr>
                <th scope="col" className="p-2">Day</th>
                <th scope="col" className="p-2">Households</th>
                <th scope="col" className="p-2">Collected</th>
              </tr>
            </thead>
            <tbody>
              {report.by_day.map((d) => (
                <tr key={d.day_id} className="border-t border-humus-100">
                  <td className="p-2">
                    {longDate(d.date)} — {d.title}
                  </td>
                  <td className="p-2">{d.households}</td>
                  <td className="p-2">
                    {formatKg(d.kg, system)} ({formatM3(d.m3, system)})
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="mt-2 text-sm text-humus-600">Figures appear once households are checked in at a giveaway day.</p>
        )}
      </Panel>

      <Panel id="staff" title="Staff">
        <StaffPanel members={members} invites={invites} isOwner={staff.isOwner} me={user.id} />
      </Panel>
    </div>
  );
}
