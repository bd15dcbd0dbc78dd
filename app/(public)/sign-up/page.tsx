import Link from "next/link";
import type { Metadata } from "next";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { PageHeading } from "@/components/ui/empty-state";
import { safeCallbackPath } from "@/lib/auth/callback-url";

export const metadata: Metadata = { title: "Join" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; email?: string }> }) {
  const { callbackUrl, email } = await searchParams;
  // Only paths on this site, so a crafted link cannot bounce people elsewhere.
  const target = typeof callbackUrl === "string" ? safeCallbackPath(callbackUrl) : undefined;
  return (
    <div className="mx-auto max-w-md">
      <PageHeading
        title="Join Duffbank"
        lead={<>Every account can plan beds and collect material. To give material away, tick it on your profile afterwards. Already joined? <Link className="text-moss-700 underline" href="/sign-in">Sign in</Link>.</>}
      />
      <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        <SignUpForm callbackUrl={target} email={typeof email === "string" ? email.slice(0, 320) : ""} />
      </div>
    </div>
  );
}
