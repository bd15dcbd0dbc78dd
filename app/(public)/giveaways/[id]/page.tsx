import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { ApiError } from "@/lib/api/errors";
import { giveawayForVisitor } from "@/lib/services/giveaways/get-giveaway-for-visitor";
import { bookingWindowState } from "@/lib/giveaways/view";
import { giveawayCautions } from "@/lib/calc/cautions";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { longDate, wallTime } from "@/lib/time/zoned";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { BookingPanel } from "@/components/giveaways/booking-panel";
import { windowLabel } from "@/components/giveaways/day-card";
import { GiveawayMap } from "@/components/giveaways/giveaway-map";
import { viewerUnits } from "@/lib/units/viewer";
import { fewHundred, formatQuantity } from "@/lib/format/quantity";

export const metadata: Metadata = { title: "Giveaway day" };
export const dynamic = "force-dynamic";

async function load(id: string, userId: string | null) {
  try {
    return await giveawayForVisitor(id, userId);
  } catch (err) {
    if (err instanceof ApiError && err.code === "not_found") return null;
    throw err;
  }
}

export default async function GiveawayPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await currentUser();
  const system = await viewerUnits(user);
  const found = await load(id, user?.id ?? null);
  if (!found) notFound();
  const { giveaway: day, my_booking: booking } = found;
  const now = new Date();
  const point = booking ? booking.exact : day.location;
  return (
    <div className="flex flex-col gap-6">
      <PageHeading
        title={day.title}
        lead={
          <>
            {day.material_name} from {day.organisation.name} on <strong>{longDate(day.date)}</strong>. Each household may take up to{" "}
            {formatGiveawayQuantity(day.household_cap, day.unit, system)}
            {day.bag_m3 ? ` (a bag of about ${formatQuantity(day.bag_m3 * 1000, "l", system)})` : ""}.
          </>
        }
      />
      {day.status === "cancelled" ? <Notice tone="error" title="This day is called off">The council cancelled it; every booking was cancelled with it.</Notice> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,440px)_1fr]">
        <div className="flex flex-col gap-4">
          <BookingPanel
            dayId={day.id}
            timeZone={day.time_zone}
            unit={day.unit}
            householdCap={day.household_cap}
            depositCents={day.deposit_cents}
            currency={day.currency}
            slots={day.slots}
            window={bookingWindowState(day, now)}
            windowLabel={windowLabel(day, now)}
            signedIn={!!user}
            booking={booking}
            now={now.toISOString()}
          />
          {day.notes ? (
            <section aria-labelledby="notes-title" className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
              <h2 id="notes-title" className="font-semibold">
                From the council
              </h2>
              <p className="mt-1 whitespace-pre-line">{day.notes}</p>
            </section>
          ) : null}
          <section aria-labelledby="care-title" className="rounded-lg border-l-4 border-litter-300 bg-litter-100 p-4">
            <h2 id="care-title" className="font-semibold">
              Take care
            </h2>
            <ul className="mt-1 list-disc pl-5 text-sm leading-relaxed">
              {giveawayCautions(day.material).map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </section>
        </div>
        <div className="flex flex-col gap-3">
          <GiveawayMap points={[{ id: day.id, ...point, label: booking ? "The place" : "Roughly here" }]} label={booking ? "Map: where to collect" : "Map: roughly where (the exact place comes with a booking)"} className="h-80" />
          <p className="text-sm text-humus-600">{booking ? booking.address : `The point is ${fewHundred(system)} from the real place; booked households get the address.`}</p>
          <table className="w-full rounded-lg bg-white text-left text-sm ring-1 ring-humus-200">
            <caption className="p-2 text-left font-semibold">Time slots</caption>
            <thead className="bg-humus-100">
              <tr>
                <th scope="col" className="p-2">Arrive</th>
                <th scope="col" className="p-2">Places left</th>
              </tr>
            </thead>
            <tbody>
              {day.slots.map((s) => (
                <tr key={s.id} className="border-t border-humus-100">
                  <td className="p-2">
                    {wallTime(s.starts_at, day.time_zone)}–{wallTime(s.ends_at, day.time_zone)}
                  </td>
                  <td className="p-2">
                    {s.remaining} of {s.capacity}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </div>
  );
}
