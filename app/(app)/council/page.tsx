import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { membersOf } from "@/db/organisations";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";

export const metadata: Metadata = { title: "Council desk" };

export default async function CouncilPage() {
  const user = await pageUser("/council", ["council"]);
  if (!user.organisation) {
    return <EmptyState title="Your account is not linked to a council yet">Ask a colleague who owns your council&apos;s account to add you.</EmptyState>;
  }
  const members = await membersOf(user.organisation.id);
  return (
    <div>
      <PageHeading title={user.organisation.name} lead="Giveaway days, the day's list and what your residents kept out of the bin." />
      <section aria-labelledby="staff-title" className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        <h2 id="staff-title" className="mb-3 text-lg font-semibold">
          Staff
        </h2>
        <ul className="divide-y divide-humus-100">
          {members.map((m: { id: string; name: string; email: string; org_role: string }) => (
            <li key={m.id} className="flex justify-between py-2">
              <span>
                {m.name} <span className="text-sm text-humus-600">{m.email}</span>
              </span>
              <span className="text-sm text-humus-700">{m.org_role === "owner" ? "Account owner" : "Staff"}</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
