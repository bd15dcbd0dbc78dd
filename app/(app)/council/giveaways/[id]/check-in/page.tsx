import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { sheetForPage } from "@/lib/services/giveaways/get-sheet-for-page";
import { localDate, longDate } from "@/lib/time/zoned";
import { Notice } from "@/components/ui/notice";
import { CheckInList } from "@/components/giveaways/check-in-list";

export const metadata: Metadata = { title: "Check in" };
export const dynamic = "force-dynamic";

export default async function CheckInPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/council/giveaways/${id}/check-in`, ["council"]);
  const { day, bookings } = await sheetForPage(user, id);
  return (
    <div className="mx-auto flex max-w-md flex-col gap-4">
      <p>
        <Link href={`/council/giveaways/${id}`} className="text-moss-700 underline">
          ← {day.title}
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Check in — {longDate(day.date)}</h1>
      {day.status === "cancelled" ? <Notice tone="error">This day is called off.</Notice> : null}
      {day.status !== "cancelled" && localDate(new Date(), day.time_zone) < day.date ? (
        // Open before the day on purpose: a household may collect early by arrangement. Say so,
        // since a check-in gives back a deposit hold at once.
        <Notice tone="caution" title={`This day is ${longDate(day.date)}`}>
          Check a household in before then only if they have collected early by arrangement: checking in gives back any deposit hold on their card at once. A check-in can be undone.
        </Notice>
      ) : null}
      <CheckInList dayId={id} unit={day.unit} timeZone={day.time_zone} now={new Date().toISOString()}
        currency={day.currency}
        rows={bookings.map((b) => ({ id: b.id, name: b.name, quantity: b.quantity, status: b.status, starts_at: b.starts_at, ends_at: b.ends_at, deposit_cents: b.deposit_cents, deposit_status: b.deposit_status }))} />
    </div>
  );
}
