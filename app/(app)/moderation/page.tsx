import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listRoleRequests } from "@/lib/services/moderation/list-role-requests";
import { listReports, type QueueRow } from "@/lib/services/moderation/list-reports";
import { groupReports } from "@/lib/moderation/group-reports";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { RoleRequestActions } from "@/components/profile/role-request-actions";
import { ReportActions } from "@/components/moderation/report-actions";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { REPORT_REASON_LABELS } from "@/lib/validation/moderation";

export const metadata: Metadata = { title: "Moderation" };
export const dynamic = "force-dynamic";

export default async function ModerationPage({ searchParams }: { searchParams: Promise<{ status?: string }> }) {
  await pageUser("/moderation", ["moderator"]);
  const { status: raw } = await searchParams;
  const status = raw === "closed" ? "closed" : "open";
  const [requests, reports] = await Promise.all([listRoleRequests(), listReports(status)]);
  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeading title="Moderation" lead="Reports from people using Duffbank, requests for roles that need a check, and the record of every action." />
        <Link href="/moderation/audit" className="font-semibold text-moss-700 underline underline-offset-4">
          Audit log
        </Link>
      </div>

      <section aria-labelledby="reports-title">
        <div className="mb-3 flex flex-wrap items-baseline gap-4">
          <h2 id="reports-title" className="text-xl font-semibold">
            Reports
          </h2>
          <nav aria-label="Report status" className="flex gap-3 text-sm">
            <Link href="/moderation" aria-current={status === "open" ? "page" : undefined} className={status === "open" ? "font-bold underline" : "text-moss-700 underline"}>
              Open
            </Link>
            <Link href="/moderation?status=closed" aria-current={status === "closed" ? "page" : undefined} className={status === "closed" ? "font-bold underline" : "text-moss-700 underline"}>
              Closed
            </Link>
          </nav>
        </div>
        {reports.length === 0 ? (
          <EmptyState title={status === "open" ? "No open reports" : "No closed reports yet"}>Reports about listings and people appear here, oldest first.</EmptyState>
        ) : (
          <ul className="flex flex-col gap-4">
            {groupReports(reports).map((g) => (
              <ReportCard key={g.key} reports={g.reports} />
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="roles-title">
        <h2 id="roles-title" className="mb-3 text-xl font-semibold">
          Role requests
        </h2>
        {requests.length === 0 ? (
          <EmptyState title="Nothing waiting">When someone asks to sell live worms, their request appears here.</EmptyState>
        ) : (
          <ul className="flex flex-col gap-3">
            {requests.map((q: { user_id: string; name: string; email: string; role: Role; created_at: string }) => (
              <li key={`${q.user_id}-${q.role}`} className="flex flex-wrap items-center justify-between gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200">
                <span>
                  <span className="font-medium">{q.name}</span> <span className="text-sm text-humus-600">{q.email}</span> asks to be a{" "}
                  <strong>{ROLE_LABELS[q.role].toLowerCase()}</strong>
                </span>
                <RoleRequestActions userId={q.user_id} role={q.role} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

function ReportCard({ reports }: { reports: QueueRow[] }) {
  const r = reports[0];
  const subject = r.listing_id ? `Listing “${r.listing_title}”` : `Account ${r.subject_name}`;
  const reasons = [...new Set(reports.map((x) => REPORT_REASON_LABELS[x.reason]))];
  return (
    <li className="grid gap-4 rounded-leaf bg-white p-5 ring-1 ring-humus-200 md:grid-cols-[1fr_minmax(0,360px)]" data-report={r.id}>
      <div className="flex flex-col gap-2">
        <p className="text-sm font-medium text-ember-800">{reasons.join(" · ")}</p>
        <h3 className="text-lg font-semibold">
          {subject}
          {reports.length > 1 ? <span className="ml-2 text-base font-normal text-humus-700">{reports.length} reports</span> : null}
        </h3>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          {r.listing_id ? (
            <>
              <dt className="font-medium">Listing status</dt>
              <dd>{r.listing_status}</dd>
            </>
          ) : null}
          <dt className="font-medium">{r.listing_id ? "Owner" : "Person"}</dt>
          <dd>
            {r.subject_name} <span className="text-humus-600">{r.subject_email}</span>
            {r.subject_suspended_at ? " · suspended" : ""}
            {r.subject_verified_at ? " · verified" : ""}
          </dd>
          <dt className="font-medium">Reports on this, ever</dt>
          <dd>{r.reports_on_subject}</dd>
        </dl>
        <ol className="flex flex-col gap-3">
          {reports.map((x, i) => (
            <li key={x.id} className={i >= 3 ? "hidden" : undefined}>
              <ReportVoice r={x} />
            </li>
          ))}
        </ol>
        {reports.length > 3 ? (
          <details>
            <summary className="cursor-pointer text-sm font-medium text-moss-700 underline underline-offset-2">The other {reports.length - 3} reports</summary>
            <ol className="mt-2 flex flex-col gap-3">
              {reports.slice(3).map((x) => (
                <li key={x.id}>
                  <ReportVoice r={x} />
                </li>
              ))}
            </ol>
          </details>
        ) : null}
        {r.outcome_note ? (
          <p className="text-sm">
            <strong>Outcome:</strong> {r.outcome_note}
          </p>
        ) : null}
      </div>
      <ReportActions
        reportIds={reports.map((x) => x.id)}
        listingId={r.listing_id}
        listingHidden={r.listing_status === "hidden"}
        userId={r.subject_user_id}
        userName={r.subject_name}
        suspended={!!r.subject_suspended_at}
        verified={!!r.subject_verified_at}
        open={r.status === "open"}
      />
    </li>
  );
}

/** One person's report: who, when, why and in their words. */
function ReportVoice({ r }: { r: QueueRow }) {
  return (
    <figure className="flex flex-col gap-1">
      <blockquote className="whitespace-pre-line border-l-4 border-humus-200 pl-3 text-humus-800">{r.text}</blockquote>
      <figcaption className="text-sm text-humus-700">
        {r.reporter_name} <span className="text-humus-600">{r.reporter_email}</span> · {REPORT_REASON_LABELS[r.reason]} · {formatLocal(r.created_at)}
      </figcaption>
    </figure>
  );
}
