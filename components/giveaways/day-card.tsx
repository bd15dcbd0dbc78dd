import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { PublicDayView } from "@/lib/giveaways/view";
import { bookingWindowState } from "@/lib/giveaways/view";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { longDate, readableDateTime, wallTime } from "@/lib/time/zoned";
import { formatDistance } from "@/lib/format/quantity";
import type { UnitSystem } from "@/lib/calc/units";

export function windowLabel(day: PublicDayView, now: Date): string {
  switch (bookingWindowState(day, now)) {
    case "cancelled":
      return "Called off";
    case "not_yet":
      return `Booking opens ${readableDateTime(day.booking_opens_at, day.time_zone)}`;
    case "closed":
      return "Booking has closed";
    case "open":
      return `Book until ${readableDateTime(day.booking_closes_at, day.time_zone)}`;
  }
}

/** A giveaway day in a list: what, when, how much a household may take, and how full it is. */
export function DayCard({ day, now, system = "metric" }: { day: PublicDayView; now: Date; system?: UnitSystem }) {
  const left = day.slots.reduce((n, s) => n + s.remaining, 0);
  const first = day.slots[0];
  const last = day.slots[day.slots.length - 1];
  return (
    <li className="flex flex-col gap-2 rounded-leaf bg-white p-5 ring-1 ring-humus-200" data-giveaway={day.id}>
      <p className="text-sm font-medium text-moss-700">
        {day.material_name} · {day.organisation.name}
      </p>
      <h3 className="text-lg font-semibold">
        <Link href={`/giveaways/${day.id}`} className="hover:underline">
          {day.title}
        </Link>
      </h3>
      <p>
        {longDate(day.date)}
        {first ? `, ${wallTime(first.starts_at, day.time_zone)}–${wallTime(last.ends_at, day.time_zone)}` : ""}
      </p>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm text-humus-700">
        <dt>Each household</dt>
        <dd>up to {formatGiveawayQuantity(day.household_cap, day.unit, system)}</dd>
        <dt>Places left</dt>
        <dd>
          {left} in {day.slots.length} {day.slots.length === 1 ? "slot" : "slots"}
        </dd>
        {day.deposit_cents > 0 ? (
          <>
            <dt>No-show deposit</dt>
            <dd>{formatMoney(day.deposit_cents, day.currency)}, refundable (a hold on your card)</dd>
          </>
        ) : null}
        {day.distance_km !== undefined ? (
          <>
            <dt>Distance</dt>
            <dd>{formatDistance(day.distance_km, system)}</dd>
          </>
        ) : null}
      </dl>
      <p className="text-sm font-medium">{windowLabel(day, now)}</p>
      <Link href={`/giveaways/${day.id}`} className="mt-1 self-start font-semibold text-moss-700 underline underline-offset-4">
        Times and booking<span className="sr-only"> for {day.title}</span>
      </Link>
    </li>
  );
}
