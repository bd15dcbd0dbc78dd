import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { sheetForPage } from "@/lib/services/giveaways/get-sheet-for-page";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { longDate, wallTime } from "@/lib/time/zoned";
import { buttonClass } from "@/components/ui/button-class";
import { PrintButton } from "@/components/giveaways/print-button";
import { depositLabel } from "@/lib/format/giveaway-deposit";

export const metadata: Metadata = { title: "Day sheet" };
export const dynamic = "force-dynamic";

const STATUS: Record<string, string> = { booked: "", checked_in: "arrived", no_show: "no-show" };

export default async function DaySheetPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/council/giveaways/${id}/sheet`, ["council"]);
  const { day, bookings, totals } = await sheetForPage(user, id);
  return (
    <div className="print-sheet flex flex-col gap-4">
      <div className="no-print flex flex-wrap gap-3">
        <Link href={`/council/giveaways/${id}`} className={buttonClass("quiet")}>
          ← Back to the day
        </Link>
        <PrintButton />
        <a href={`/api/council/giveaways/${id}/sheet.csv`} className={buttonClass("secondary")}>
          Download CSV
        </a>
      </div>
      <header>
        <p className="text-sm">{day.organisation.name}</p>
        <h1 className="text-2xl font-bold">
          {day.title} — {longDate(day.date)}
        </h1>
        <p>
          {day.exact.address}. {day.material_name}, up to {formatGiveawayQuantity(day.household_cap, day.unit)} a household. {totals.households} households booked,{" "}
          {formatGiveawayQuantity(totals.quantity, day.unit)} in all.
        </p>
      </header>
      {day.slots.map((s) => {
        const rows = bookings.filter((b) => b.slot_id === s.id);
        return (
          <section key={s.id} aria-label={`Slot ${wallTime(s.starts_at, day.time_zone)}`}>
            <h2 className="mt-2 border-b-2 border-humus-900 text-lg font-semibold">
              {wallTime(s.starts_at, day.time_zone)}–{wallTime(s.ends_at, day.time_zone)}{" "}
              <span className="text-sm font-normal">
                ({rows.length} of {s.capacity})
              </span>
            </h2>
            {rows.length ? (
              <table className="w-full text-left text-sm">
                <thead>
                  <tr>
                    <th scope="col" className="w-10 p-1">
                      ✓
                    </th>
                    <th scope="col" className="p-1">Household</th>
                    <th scope="col" className="p-1">E-mail</th>
                    <th scope="col" className="p-1">Taking</th>
                    <th scope="col" className="p-1">Status</th>
                    {day.deposit_cents ? (
                      <th scope="col" className="p-1">
                        Deposit
                      </th>
                    ) : null}
                  </tr>
                </thead>
                <tbody>
                  {rows.map((b) => (
                    <tr key={b.id} className="border-b border-humus-200">
                      <td className="p-1">
                        <span aria-hidden="true" className="inline-block h-4 w-4 border border-humus-900" />
                      </td>
                      <td className="p-1 font-medium">{b.name}</td>
                      <td className="p-1">{b.email}</td>
                      <td className="p-1">{formatGiveawayQuantity(b.quantity, day.unit)}</td>
                      <td className="p-1">{STATUS[b.status] ?? b.status}</td>
                      {day.deposit_cents ? <td className="p-1">{depositLabel(b.deposit_cents, day.currency, b.deposit_status)}</td> : null}
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : (
              <p className="p-1 text-sm">Nobody booked.</p>
            )}
          </section>
        );
      })}
    </div>
  );
}
