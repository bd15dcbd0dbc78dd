import Link from "next/link";
import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { describeInvite } from "@/lib/services/council/describe-invite";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button-class";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { AcceptInvite } from "@/components/council/accept-invite";

export const metadata: Metadata = { title: "Join your council's desk" };
export const dynamic = "force-dynamic";

const CLOSED: Record<string, string> = {
  accepted: "This invitation has already been used. If it was you, the council desk is in your menu.",
  revoked: "This invitation was withdrawn. Ask your council's account owner for a new one.",
  expired: "This invitation has expired. Ask your council's account owner for a new one.",
};

export default async function JoinCouncilPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const invite = typeof token === "string" && token.length >= 20 ? await describeInvite(token) : null;
  const user = await currentUser();
  const here = `/council/join?token=${encodeURIComponent(token ?? "")}`;
  return (
    <div className="mx-auto flex max-w-md flex-col gap-4">
      <PageHeading title="Join your council's desk" />
      {!invite ? (
        <Notice tone="error">This invitation link is not valid. Check that the whole link was copied from the e-mail.</Notice>
      ) : invite.status !== "pending" ? (
        <Notice tone="error">{CLOSED[invite.status]}</Notice>
      ) : (
        <div className="flex flex-col gap-4 rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <p>
            You are invited to run giveaway days for <strong>{invite.organisation}</strong>. The invitation is for <strong>{invite.email}</strong>.
          </p>
          {user && user.email === invite.email ? (
            <AcceptInvite token={token!} organisation={invite.organisation} />
          ) : user ? (
            <>
              <Notice>
                You are signed in as {user.email}. Sign out, then sign in as {invite.email} to accept.
              </Notice>
              <SignOutButton />
            </>
          ) : invite.has_account ? (
            <Link href={`/sign-in?callbackUrl=${encodeURIComponent(here)}`} className={buttonClass("primary")}>
              Sign in as {invite.email}
            </Link>
          ) : (
            <>
              <p>There is no Duffbank account with that address yet. Join first with it, and you come straight back here.</p>
              <Link href={`/sign-up?email=${encodeURIComponent(invite.email)}&callbackUrl=${encodeURIComponent(here)}`} className={buttonClass("primary")}>
                Join Duffbank as {invite.email}
              </Link>
            </>
          )}
        </div>
      )}
    </div>
  );
}
