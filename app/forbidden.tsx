import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";

export default function Forbidden() {
  return (
    <section className="mx-auto flex max-w-xl flex-col gap-4 py-10" aria-labelledby="forbidden-title">
      <p className="font-mono text-sm text-humus-600">403</p>
      <h1 id="forbidden-title" className="text-3xl font-bold">This part of Duffbank is not open to your account</h1>
      <p className="text-humus-700">
        It belongs to another role — council staff, moderators, or people giving material away. If you think your account should have it, ask for the
        role on your profile.
      </p>
      <div className="flex gap-3">
        <Link href="/profile" className={buttonClass("primary")}>
          Go to my profile
        </Link>
        <Link href="/" className={buttonClass("secondary")}>
          Back to the start
        </Link>
      </div>
    </section>
  );
}
