import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { pendingRoleRequests } from "@/db/organisations";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { RoleRequestActions } from "@/components/profile/role-request-actions";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Moderation" };

export default async function ModerationPage() {
  await pageUser("/moderation", ["moderator"]);
  const requests = await pendingRoleRequests();
  return (
    <div>
      <PageHeading title="Moderation" lead="Requests for roles that need a person's check before they are granted." />
      {requests.length === 0 ? (
        <EmptyState title="Nothing waiting">When someone asks to sell live worms, their request appears here.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-3">
          {requests.map((r: { user_id: string; name: string; email: string; role: Role; created_at: string }) => (
            <li key={`${r.user_id}-${r.role}`} className="flex flex-wrap items-center justify-between gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200">
              <span>
                <span className="font-medium">{r.name}</span> <span className="text-sm text-humus-600">{r.email}</span> asks to be a{" "}
                <strong>{ROLE_LABELS[r.role].toLowerCase()}</strong>
              </span>
              <RoleRequestActions userId={r.user_id} role={r.role} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
