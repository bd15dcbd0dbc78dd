import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { listReservations } from "@/lib/services/reservations/list-reservations";
import type { ReservationView } from "@/lib/reservations/view";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { ReservationCard } from "@/components/reservations/reservation-card";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Requests" };

const GROUPS: { id: string; title: string; empty: string; has: (v: ReservationView) => boolean }[] = [
  { id: "answer", title: "Waiting for your answer", empty: "No requests waiting.", has: (v) => v.status === "held" },
  { id: "collect", title: "To be collected or posted", empty: "Nobody is due to collect, and nothing is waiting to be posted.", has: (v) => v.status === "confirmed" },
  { id: "done", title: "Done", empty: "", has: (v) => v.status !== "held" && v.status !== "confirmed" },
];

export default async function RequestsPage() {
  const user = await pageUser("/requests", LISTING_ROLES);
  const system = await viewerUnits(user);
  const views = await listReservations(user.id, "supplier");
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading
        title="Requests"
        lead={`Reservations on the listings you${user.organisation ? ` and ${user.organisation.name}` : ""} give: accept or decline, check the pickup code at the gate, and keep in touch.`}
      />
      {views.length === 0 ? (
        <EmptyState title="No requests yet">When a gardener reserves something you have listed, it appears here and in your e-mail.</EmptyState>
      ) : (
        <div className="flex flex-col gap-8">
          {GROUPS.map((g) => {
            const items = views.filter(g.has);
            if (g.id === "done" && items.length === 0) return null;
            return (
              <section key={g.id} aria-labelledby={`${g.id}-title`} className="flex flex-col gap-4">
                <h2 id={`${g.id}-title`} className="text-xl font-bold">
                  {g.title} ({items.length})
                </h2>
                {items.length === 0 ? <p className="text-humus-700">{g.empty}</p> : items.map((v) => <ReservationCard key={v.id} v={v} system={system} />)}
              </section>
            );
          })}
        </div>
      )}
    </div>
  );
}
