import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { searchAudit } from "@/lib/services/moderation/search-audit";
import { PageHeading } from "@/components/ui/empty-state";
import { AuditTable } from "@/components/moderation/audit-table";

export const metadata: Metadata = { title: "Audit log" };
export const dynamic = "force-dynamic";

/** The latest entries are filtered in the browser; older ones page through the API (GET /api/moderation/audit?before_id=). */
const RECENT = 500;

export default async function AuditPage() {
  await pageUser("/moderation/audit", ["moderator"]);
  const items = await searchAudit({ limit: RECENT });
  return (
    <div className="flex flex-col gap-4">
      <p>
        <Link href="/moderation" className="text-moss-700 underline">
          ← Moderation
        </Link>
      </p>
      <PageHeading
        title="Audit log"
        lead={`Every moderator and council action: who, what, when, and the values before and after. The log only grows — the database refuses to change or delete a line. Showing the latest ${RECENT}.`}
      />
      <AuditTable items={items} />
    </div>
  );
}
