import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { db } from "@/db/index";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { LISTING_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "What I'm giving" };

export default async function MyListingsPage() {
  const user = await pageUser("/listings/mine", LISTING_ROLES);
  const rows: { id: string; title: string; status: string; unit: string; quantity_total: number; quantity_held: number; quantity_collected: number }[] = await db()("listings")
    .select("id", "title", "status", "unit", "quantity_total", "quantity_held", "quantity_collected")
    .where((q) => {
      q.where("owner_id", user.id);
      if (user.organisation) q.orWhere("organisation_id", user.organisation.id);
    })
    .orderBy("updated_at", "desc");
  return (
    <div>
      <PageHeading title="What I'm giving" lead="Your listings, how much is left, and what is on hold." />
      {rows.length === 0 ? (
        <EmptyState title="Nothing listed yet">When you post spare leaves, boxes or bales, they appear here.</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-humus-200">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">My listings</caption>
            <thead className="bg-humus-100">
              <tr>
                <th scope="col" className="p-3">Listing</th>
                <th scope="col" className="p-3">Status</th>
                <th scope="col" className="p-3">Left</th>
                <th scope="col" className="p-3">On hold</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id} className="border-t border-humus-100">
                  <td className="p-3 font-medium">{r.title}</td>
                  <td className="p-3">{r.status}</td>
                  <td className="p-3">
                    {Math.max(0, r.quantity_total - r.quantity_held - r.quantity_collected)} {r.unit}
                  </td>
                  <td className="p-3">
                    {r.quantity_held} {r.unit}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
