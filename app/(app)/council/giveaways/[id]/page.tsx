import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { sheetForPage } from "@/lib/services/giveaways/get-sheet-for-page";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { longDate, readableDateTime } from "@/lib/time/zoned";
import { PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { DayForm } from "@/components/giveaways/day-form";
import { valuesFromDay } from "@/components/giveaways/day-form-model";
import { SlotEditor } from "@/components/giveaways/slot-editor";
import { CancelDayForm } from "@/components/giveaways/cancel-day-form";
import { Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Giveaway day" };
export const dynamic = "force-dynamic";

export default async function CouncilDayPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/council/giveaways/${id}`, ["council"]);
  const { day, totals } = await sheetForPage(user, id);
  const booked = day.slots.reduce((n, s) => n + s.booked, 0);
  const live = day.status === "scheduled";
  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link href="/council" className="text-moss-700 underline">
          ← Council desk
        </Link>
      </p>
      <PageHeading
        title={day.title}
        lead={
          <>
            {day.material_name}, {longDate(day.date)}, at {day.exact.address}. Up to {formatGiveawayQuantity(day.household_cap, day.unit)} a household
            {day.deposit_cents ? `; refundable no-show deposit ${formatMoney(day.deposit_cents, day.currency)}, held on each household's card` : ""}. Booking closes{" "}
            {readableDateTime(day.booking_closes_at, day.time_zone)}.
          </>
        }
      />
      {!live ? (
        <Notice tone="error" title="Called off">
          {day.cancel_reason}
        </Notice>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Link href={`/council/giveaways/${id}/sheet`} className={buttonClass("secondary")}>
          The day&apos;s sheet (print)
        </Link>
        <a href={`/api/council/giveaways/${id}/sheet.csv`} className={buttonClass("secondary")}>
          Download CSV
        </a>
        <Link href={`/council/giveaways/${id}/check-in`} className={buttonClass("primary")}>
          Check households in
        </Link>
        <Link href={`/giveaways/${id}`} className={buttonClass("quiet")}>
          Public page
        </Link>
      </div>
      <p>
        <strong>{totals.households}</strong> households booked, <strong>{totals.checked_in}</strong> checked in; {formatGiveawayQuantity(totals.quantity, day.unit)} asked for.
      </p>

      <Panel id="slots" title="Time slots">
        <SlotEditor dayId={id} slots={day.slots} timeZone={day.time_zone} editable={live} />
      </Panel>

      {live ? (
        <>
          <Panel id="edit" title="Change the day">
            <DayForm mode="edit" dayId={id} initial={valuesFromDay(day)} locked={booked > 0} />
          </Panel>
          <section aria-labelledby="cancel-title" className="rounded-leaf bg-white p-6 ring-1 ring-ember-600/40">
            <h2 id="cancel-title" className="mb-3 text-lg font-semibold">
              Call the day off
            </h2>
            <CancelDayForm dayId={id} booked={booked} depositCents={day.deposit_cents} />
          </section>
        </>
      ) : null}
    </div>
  );
}
