import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { getListingBrief } from "@/lib/services/listings/get-listing-brief";
import { getAccount } from "@/lib/services/accounts/get-account";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { ReportForm } from "@/components/moderation/report-form";

export const metadata: Metadata = { title: "Report a problem" };

export default async function ReportPage({ searchParams }: { searchParams: Promise<{ listing?: string; user?: string }> }) {
  const { listing, user: userParam } = await searchParams;
  const path = `/report?${listing ? `listing=${encodeURIComponent(listing)}` : `user=${encodeURIComponent(userParam ?? "")}`}`;
  const me = await pageUser(path);
  let subject: { label: string; listingId?: string; userId?: string; hidden?: boolean; own: boolean } | null = null;
  if (typeof listing === "string" && listing) {
    const l = await getListingBrief(listing);
    if (l && l.status !== "draft") subject = { label: `the listing “${l.title}” by ${l.owner_name}`, listingId: l.id, hidden: l.status === "hidden", own: l.owner_id === me.id };
  } else if (typeof userParam === "string" && userParam) {
    const u = await getAccount(userParam);
    if (u) subject = { label: u.display_name, userId: u.id, own: u.id === me.id };
  }
  if (!subject) notFound();
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-4">
      <PageHeading title="Report a problem" lead="Tell the Duffbank moderators about contaminated or misdescribed material, a no-show, or anything unsafe. The person you report does not see who reported them." />
      {subject.hidden ? <Notice>This listing is already hidden from browsing while moderators look at it. You can still add what you know.</Notice> : null}
      {subject.own ? (
        <Notice tone="error">This is your own {subject.listingId ? "listing" : "account"}; you cannot report it.</Notice>
      ) : (
        <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <ReportForm listingId={subject.listingId} userId={subject.userId} subjectLabel={subject.label} />
        </div>
      )}
      <p className="text-sm text-humus-600">If someone is in danger, call the emergency services first. For sprays or contamination, your local authority&apos;s advice comes first.</p>
    </div>
  );
}
