import Link from "next/link";
import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { searchGiveaways } from "@/lib/services/giveaways/search-giveaways";
import { listMyBookings } from "@/lib/services/giveaways/list-my-bookings";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { addDays, longDate, wallTime } from "@/lib/time/zoned";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { DayCard } from "@/components/giveaways/day-card";
import { GiveawayMap } from "@/components/giveaways/giveaway-map";
import { viewerUnits } from "@/lib/units/viewer";
import { fewHundred } from "@/lib/format/quantity";

export const metadata: Metadata = { title: "Giveaway days" };
export const dynamic = "force-dynamic";

export default async function GiveawaysPage() {
  const now = new Date();
  const [user, days] = await Promise.all([currentUser(), searchGiveaways({ radius_km: 25 })]);
  const system = await viewerUnits(user);
  const mine = user ? await listMyBookings(user.id, addDays(now.toISOString().slice(0, 10), -1)) : [];
  return (
    <div className="flex flex-col gap-8">
      <PageHeading
        title="Giveaway days"
        lead="Councils hand out leaves, wood chips and compost on set days. Book a time slot for your household, bring bags or a trailer, and collect."
      />
      {mine.length ? (
        <section aria-labelledby="mine-title" className="rounded-leaf bg-moss-50 p-5 ring-1 ring-moss-200">
          <h2 id="mine-title" className="mb-2 text-lg font-semibold">
            Your bookings
          </h2>
          <ul className="flex flex-col gap-1">
            {mine.map((b) => (
              <li key={b.id}>
                <Link href={`/giveaways/${b.day_id}`} className="font-medium text-moss-800 underline underline-offset-4">
                  {b.title}
                </Link>{" "}
                — {longDate(b.date)}, {wallTime(b.starts_at, b.time_zone)}–{wallTime(b.ends_at, b.time_zone)}, {formatGiveawayQuantity(b.quantity, b.unit, system)}
                {b.status === "checked_in" ? " (collected)" : ""}
                {b.day_status === "cancelled" ? " — called off" : ""}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {days.length === 0 ? (
        <EmptyState title="No giveaway days coming up">When a council near you posts a leaf, chip or compost day, it appears here.</EmptyState>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[1fr_minmax(0,420px)]">
          <section aria-labelledby="days-title">
            <h2 id="days-title" className="sr-only">
              Upcoming days
            </h2>
            <ul className="grid gap-4 md:grid-cols-2">
              {days.map((d) => (
                <DayCard key={d.id} day={d} now={now} system={system} />
              ))}
            </ul>
          </section>
          <GiveawayMap points={days.map((d) => ({ id: d.id, lat: d.location.lat, lng: d.location.lng, label: d.title }))} />
        </div>
      )}
      <p className="max-w-prose text-sm text-humus-600">
        Places on the map are approximate, {fewHundred(system)} off; the exact address comes with your booking. One booking per household a day — for now a
        household is one Duffbank account.
      </p>
      {!user ? (
        <p>
          <Link href="/sign-in?callbackUrl=%2Fgiveaways" className="font-semibold text-moss-700 underline underline-offset-4">
            Sign in
          </Link>{" "}
          to book a slot.
        </p>
      ) : null}
    </div>
  );
}
