import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listBeds } from "@/lib/services/beds/list-beds";
import { listNeeds } from "@/lib/services/needs/list-needs";
import { listAlerts } from "@/lib/services/needs/list-alerts";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";
import { AlertCard, NeedCard } from "@/components/needs/need-list";
import { OpenNeedForm } from "@/components/needs/open-need-form";
import { needFormValues } from "@/components/needs/need-form-values";
import { formatQuantity } from "@/lib/format/quantity";
import { MIN_CELL_AREA_KM2 } from "@/lib/needs/grid";

export const metadata: Metadata = { title: "My needs" };
export const dynamic = "force-dynamic";

export default async function NeedsPage() {
  const user = await pageUser("/needs", ["gardener"]);
  const [needs, alerts, beds] = await Promise.all([listNeeds(user.id), listAlerts(user.id, { openOnly: true }), listBeds(user.id)]);
  const open = needs.filter((n) => n.status === "open");
  const done = needs.filter((n) => n.status !== "open");
  return (
    <div className="flex flex-col gap-8">
      <PageHeading
        title="My needs"
        lead={`What your beds still lack, or anything you are after. When someone lists it near enough, you hear at once or in a daily e-mail. Nobody else sees your needs: suppliers and councils only see counts for areas of ${formatQuantity(MIN_CELL_AREA_KM2, "km2", user.unit_system)} or more.`}
      />

      <Panel id="found" title="Found for you">
        {alerts.length ? (
          <ul className="grid gap-3 md:grid-cols-2">
            {alerts.map((a) => (
              <AlertCard key={a.id} alert={a} system={user.unit_system} />
            ))}
          </ul>
        ) : (
          <p className="text-humus-700">Nothing yet. Listings that could serve an open need appear here, and by e-mail.</p>
        )}
      </Panel>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,24rem)]">
        <section aria-labelledby="open-title" className="flex flex-col gap-3">
          <h2 id="open-title" className="text-xl font-semibold">
            Open needs
          </h2>
          {open.length ? (
            <ul className="flex flex-col gap-3">
              {open.map((n) => (
                <NeedCard key={n.id} need={n} system={user.unit_system} />
              ))}
            </ul>
          ) : (
            <EmptyState title="No open needs">Ask for something here, or from a bed&apos;s “Find materials” page when nothing nearby covers it.</EmptyState>
          )}
          {done.length ? (
            <details>
              <summary className="cursor-pointer font-medium">Met, closed and past ({done.length})</summary>
              <ul className="mt-3 flex flex-col gap-3">
                {done.map((n) => (
                  <NeedCard key={n.id} need={n} system={user.unit_system} />
                ))}
              </ul>
            </details>
          ) : null}
        </section>
        <Panel id="ask" title="Ask for something">
          <OpenNeedForm
            system={user.unit_system}
            initial={needFormValues(user.unit_system)}
            beds={beds.map((b) => ({ id: b.id, name: b.name, placed: b.lat !== null && b.lng !== null }))}
          />
        </Panel>
      </div>
    </div>
  );
}
