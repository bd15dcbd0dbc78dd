import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { findCheckoutGroup } from "@/lib/services/reservations/find-checkout-group";
import { getReservations } from "@/lib/services/reservations/get-reservations";
import { whatLabel } from "@/lib/reservations/labels";
import { PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { AutoRefresh } from "@/components/reservations/auto-refresh";
import { ReservationCard } from "@/components/reservations/reservation-card";
import type { ReservationView } from "@/lib/reservations/view";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Payment" };

/** What came back from the checkout page, in a word: the money's state. */
function returnedTitle(v: ReservationView): string {
  switch (v.payment.state) {
    case "authorised":
      return "Deposit held";
    case "paid":
      return "Paid";
    default:
      return v.amount_cents > 0 ? "Payment received" : "Deposit received";
  }
}

function moneyLine(v: ReservationView): string {
  if (v.payment.state === "authorised") return `${formatMoney(v.deposit_cents, v.currency)} is held on your card as a deposit; nothing is taken unless you do not come.`;
  if (v.payment.state === "paid") return `You paid ${formatMoney(v.amount_cents, v.currency)}.`;
  return "";
}

// Where Stripe's checkout sends the browser back. It shows what the webhook has told us so
// far (the redirect itself proves nothing), and waits a little for it if needed. A group
// from "Reserve all" carries on to the next reservation that still needs paying.
export default async function PaidPage({ searchParams }: { searchParams: Promise<{ session_id?: string }> }) {
  const { session_id } = await searchParams;
  // Signed out (a session that ended meanwhile): sign in and come back to this very page.
  const user = await pageUser(session_id ? `/reservations/paid?session_id=${encodeURIComponent(session_id)}` : "/reservations");
  const system = await viewerUnits(user);
  if (!session_id) notFound();
  const row = await findCheckoutGroup(session_id, user.id);
  if (!row) notFound();
  const views = await getReservations(row.ids, user.id, "gardener");
  const mine = views.find((v) => v.id === row.id)!;
  const waiting = mine.payment.state === "awaiting";
  const next = views.find((v) => v.can_pay && v.id !== mine.id);
  const deposit = mine.amount_cents === 0;
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeading title={waiting ? (deposit ? "Checking your deposit" : "Checking your payment") : returnedTitle(mine)} />
      {waiting ? (
        <>
          <AutoRefresh />
          <Notice title="Almost there">Stripe is confirming it; this page updates by itself in a moment.</Notice>
        </>
      ) : (
        <Notice title={mine.status === "confirmed" ? "You are all set" : "Thank you"}>
          {moneyLine(mine)}{" "}
          {mine.status === "confirmed"
            ? "The supplier has accepted: the address and your pickup code are below and in your e-mail."
            : mine.status === "held"
              ? `We have sent your request to ${mine.supplier.name}; they have until ${formatLocal(mine.hold_expires_at!)} to accept. You will get an e-mail when they answer.`
              : ""}
        </Notice>
      )}
      {next ? (
        <Notice tone="caution" title="One more to pay">
          <p>{whatLabel({ quantity: next.quantity, listing: next.listing }, system)} is still waiting for its payment.</p>
          {next.payment.checkout_url ? (
            <a className={buttonClass("primary", "mt-2")} href={next.payment.checkout_url}>
              Pay for the next one
            </a>
          ) : null}
        </Notice>
      ) : null}
      <ReservationCard v={mine} system={system} />
      <Link href="/reservations" className={buttonClass("secondary", "self-start")}>
        All my reservations
      </Link>
    </div>
  );
}
