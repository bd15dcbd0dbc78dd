import Link from "next/link";
import type { Metadata } from "next";
import { MagicLinkForm, SignInForm } from "@/components/auth/sign-in-form";
import { Notice } from "@/components/ui/notice";
import { PageHeading } from "@/components/ui/empty-state";
import { afterSignInPath } from "@/lib/auth/callback-url";

export const metadata: Metadata = { title: "Sign in" };

const ERRORS: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Ask for a new one.",
  AccessDenied: "We could not sign you in with that link. If you are new here, join first.",
  CredentialsSignin: "That e-mail and password do not match an account. Check both and try again.",
  suspended: "This account is suspended. Contact the Duffbank team.",
};

function errorMessage(error: string, retryAfter: string | undefined): string {
  if (error === "rate_limited") {
    const minutes = Math.max(1, Math.ceil(Number(retryAfter) / 60) || 15);
    return `Too many attempts. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`;
  }
  return ERRORS[error] ?? "We could not sign you in. Please try again.";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string; retry_after?: string; changed?: string }> }) {
  const { callbackUrl, error, retry_after, changed } = await searchParams;
  // Only paths on this site, so a crafted link cannot bounce people elsewhere.
  const target = afterSignInPath(callbackUrl);
  return (
    <div className="mx-auto max-w-md">
      <PageHeading title="Sign in" lead={<>New to Duffbank? <Link className="text-moss-700 underline" href="/sign-up">Join in a minute</Link>.</>} />
      <div className="flex flex-col gap-8 rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        {changed ? <Notice title="Signed out everywhere">Sign in again{changed === "password" ? " with your new password" : ""}.</Notice> : null}
        <SignInForm callbackUrl={target} initialError={typeof error === "string" ? errorMessage(error, retry_after) : null} />
        <hr className="border-humus-200" />
        <MagicLinkForm callbackUrl={target} />
      </div>
    </div>
  );
}
