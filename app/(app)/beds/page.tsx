import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listBeds } from "@/lib/services/beds/list-beds";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { formatQuantity } from "@/lib/format/quantity";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "My beds" };

export default async function BedsPage() {
  const user = await pageUser("/beds", ["gardener"]);
  const system = await viewerUnits(user);
  const beds = await listBeds(user.id);
  return (
    <div>
      <PageHeading title="My beds" lead="Each bed keeps its recipe, its material list and its year of reminders." />
      {beds.length === 0 ? (
        <EmptyState title="No beds yet" action={<Link className={buttonClass()} href="/plan">Plan a bed</Link>}>
          Start with the size of the patch you want to cover.
        </EmptyState>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2">
          {beds.map((b) => (
            <li key={b.id} className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
              <Link href={`/beds/${b.id}`} className="font-semibold text-moss-700 underline-offset-4 hover:underline">
                {b.name}
              </Link>
              <p className="text-sm text-humus-600">
                {formatQuantity(b.area_m2, "m2", system)}
                {b.start_date ? ` · built ${b.start_date}` : ""}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
