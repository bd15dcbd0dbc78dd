import Link from "next/link";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { db } from "@/db/index";
import { getReservations } from "@/lib/services/list-reservations";
import { whatLabel } from "@/lib/reservations/labels";
import { PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { AutoRefresh } from "@/components/reservations/auto-refresh";
import { ReservationCard } from "@/components/reservations/reservation-card";

export const metadata: Metadata = { title: "Payment" };

// Where Stripe's checkout sends the browser back. It shows what the webhook has told us so
// far (the redirect itself proves nothing), and waits a little for it if needed. A group
// from "Reserve all" carries on to the next reservation that still needs paying.
export default async function PaidPage({ searchParams }: { searchParams: Promise<{ session_id?: string }> }) {
  const user = await pageUser("/reservations");
  const { session_id } = await searchParams;
  if (!session_id) notFound();
  const row = await db()("payments as p")
    .join("reservations as r", "r.id", "p.reservation_id")
    .first("r.id", "r.group_id")
    .where({ "p.provider_ref": session_id, "r.gardener_id": user.id });
  if (!row) notFound();
  const ids: string[] = row.group_id ? await db()("reservations").where({ group_id: row.group_id }).orderBy("created_at").pluck("id") : [row.id];
  const views = await getReservations(ids, user.id, "gardener");
  const mine = views.find((v) => v.id === row.id)!;
  const waiting = mine.payment.state === "awaiting";
  const next = views.find((v) => v.can_pay && v.id !== mine.id);
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeading title={waiting ? "Checking your payment" : "Payment received"} />
      {waiting ? (
        <>
          <AutoRefresh />
          <Notice title="Almost there">Stripe is confirming the payment; this page updates by itself in a moment.</Notice>
        </>
      ) : (
        <Notice title={mine.status === "confirmed" ? "You are all set" : "Thank you"}>
          {mine.status === "confirmed"
            ? "The supplier has accepted: the address and your pickup code are below and in your e-mail."
            : `We have sent your request to ${mine.supplier.name}. You will get an e-mail when they accept.`}
        </Notice>
      )}
      {next ? (
        <Notice tone="caution" title="One more to pay">
          <p>{whatLabel({ quantity: next.quantity, listing: next.listing })} is still waiting for its payment.</p>
          {next.payment.checkout_url ? (
            <a className={buttonClass("primary", "mt-2")} href={next.payment.checkout_url}>
              Pay for the next one
            </a>
          ) : null}
        </Notice>
      ) : null}
      <ReservationCard v={mine} />
      <Link href="/reservations" className={buttonClass("secondary", "self-start")}>
        All my reservations
      </Link>
    </div>
  );
}
