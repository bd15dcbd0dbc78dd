import Link from "next/link";
import type { Metadata } from "next";
import { MagicLinkForm, SignInForm } from "@/components/auth/sign-in-form";
import { PageHeading } from "@/components/ui/empty-state";

export const metadata: Metadata = { title: "Sign in" };

function safeCallback(url: string | undefined): string {
  // Only paths on this site, so a crafted link cannot bounce people elsewhere.
  return url && url.startsWith("/") && !url.startsWith("//") ? url : "/";
}

const ERRORS: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Ask for a new one.",
  AccessDenied: "We could not sign you in with that link. If you are new here, join first.",
  CredentialsSignin: "That e-mail and password do not match an account. Check both and try again.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string }> }) {
  const { callbackUrl, error } = await searchParams;
  const target = safeCallback(callbackUrl);
  return (
    <div className="mx-auto max-w-md">
      <PageHeading title="Sign in" lead={<>New to Duffbank? <Link className="text-moss-700 underline" href="/sign-up">Join in a minute</Link>.</>} />
      <div className="flex flex-col gap-8 rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        <SignInForm callbackUrl={target} initialError={error ? (ERRORS[error] ?? "We could not sign you in. Please try again.") : null} />
        <hr className="border-humus-200" />
        <MagicLinkForm callbackUrl={target} />
      </div>
    </div>
  );
}
