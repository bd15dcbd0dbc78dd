import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";

export default function NotFound() {
  return (
    <section className="mx-auto flex max-w-xl flex-col gap-4 py-10">
      <p className="font-mono text-sm text-humus-600">404</p>
      <h1 className="text-3xl font-bold">Nothing here — it may have composted</h1>
      <p className="text-humus-700">The page or item you followed does not exist, or is not yours to see.</p>
      <Link href="/" className={buttonClass("primary", "self-start")}>
        Back to the start
      </Link>
    </section>
  );
}
