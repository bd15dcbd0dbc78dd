import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { cultureStock } from "@/lib/services/growers/list-culture-stock";
import { growerOrders } from "@/lib/services/growers/list-grower-orders";
import { dayLabel } from "@/lib/reservations/culture-orders";
import { OrderCard } from "@/components/grower/order-card";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { ShippingForm } from "@/components/grower/shipping-form";
import { ShippingNotice } from "@/components/grower/shipping-notice";
import { CultureForm } from "@/components/grower/culture-form";
import { Panel } from "@/components/ui/panel";
import { viewerUnits } from "@/lib/units/viewer";
import { formatListingPrice, packCount, wholePacks } from "@/lib/listings/packs";
import { formatListingQuantity } from "@/lib/listings/format";

export const metadata: Metadata = { title: "Worm cultures" };
export const dynamic = "force-dynamic";

export default async function GrowerPage() {
  const user = await pageUser("/grower", ["grower"]);
  const system = await viewerUnits(user);
  const [stock, { orders, shipping, next_posting_day }] = await Promise.all([cultureStock(user.id), growerOrders(user.id)]);
  const count = (stage: string) => orders.filter((o) => o.status === "confirmed" && o.order?.fulfilment === "post" && o.order.stage === stage).length;
  const toAnswer = orders.filter((o) => o.status === "held").length;
  const summary = [
    toAnswer ? `${toAnswer} to answer` : null,
    count("paid") ? `${count("paid")} to pack` : null,
    count("packed") ? `${count("packed")} to post` : null,
    count("shipped") ? `${count("shipped")} in the post` : null,
  ].filter(Boolean);
  return (
    <div className="flex flex-col gap-6">
      <PageHeading title="Worm cultures" lead="Open orders to pack and post, stock left on each live-culture listing, the days you post, and a pause for heat or frost that buyers see on your listings." />
      <Notice tone="caution" title="Live animals">
        Worms suffer in hot or freezing parcels: extension guidance puts their comfortable range at about 55–78 °F (13–26 °C). Some earthworm species are
        invasive in some regions — name the species on every listing, and buyers should follow their local rules.
      </Notice>

      <Panel
        id="orders"
        title="Open orders"
        action={
          <Link href="/requests" className="text-sm text-moss-700 underline underline-offset-4">
            All requests
          </Link>
        }
      >
        <p className="mb-4 text-sm text-humus-700" data-testid="orders-summary">
          {shipping.paused
            ? "Posting is paused: parcels wait until you resume it under Shipping days."
            : next_posting_day
              ? `Next posting day: ${dayLabel(next_posting_day)} (you post on ${shipping.ship_days.join(" and ")}).`
              : null}
          {summary.length ? ` ${summary.join(" · ")}.` : ""}
        </p>
        {orders.length === 0 ? (
          <EmptyState title="No open orders">When someone orders one of your cultures, it appears here and in your e-mail, with their address if you post it.</EmptyState>
        ) : (
          <div className="flex flex-col gap-4">
            {orders.map((v) => (
              <OrderCard key={v.id} v={v} system={system} />
            ))}
          </div>
        )}
      </Panel>

      <Panel id="stock" title="Stock left">
        {stock.length === 0 ? (
          <EmptyState title="No worm listings yet">List a culture by the kilogram or by the pack under “What I&apos;m giving”; it appears here with its stock.</EmptyState>
        ) : (
          <ul className="flex flex-col gap-4">
            {stock.map((s, i) => (
              <li key={s.id} className="grid gap-4 border-t border-humus-100 pt-4 first:border-0 first:pt-0 md:grid-cols-[1fr_minmax(0,360px)]" data-listing={s.id}>
                <div>
                  <h3 className="font-semibold">{s.title}</h3>
                  <p className="text-sm text-humus-700">
                    {s.status} · {formatListingPrice({ ...s, unit: "kg" }, system)}
                  </p>
                  <p className="mt-2 text-2xl font-bold">
                    {formatListingQuantity(s.kg_left, "kg", system)} left{s.pack ? ` (${packCount(wholePacks(s.kg_left, s.pack))})` : ""}
                  </p>
                  <p className="text-sm text-humus-700">
                    About {s.estimated_count.toLocaleString("en-GB")} worms (roughly 1,000 a pound — common practice, not a count){s.kg_held ? ` · ${formatListingQuantity(s.kg_held, "kg", system)} on hold` : ""}
                  </p>
                  {!s.species ? <p className="mt-2 font-medium text-ember-800">No species named yet: buyers need it. Add it here.</p> : null}
                </div>
                <CultureForm
                  listingId={s.id}
                  // Two listings of one title would give two forms of one name: number them apart.
                  title={stock.filter((x) => x.title === s.title).length > 1 ? `${s.title} (${i + 1} of ${stock.length})` : s.title}
                  initial={{ species: s.species, ships: s.ships, pickup: s.pickup }} />
              </li>
            ))}
          </ul>
        )}
      </Panel>

      <Panel id="ship" title="Shipping days">
        <p className="mb-2 text-sm text-humus-700">What buyers read now:</p>
        <ShippingNotice shipping={shipping} />
        <div className="mt-4">
          <ShippingForm initial={{ ship_weekdays: shipping.ship_weekdays, paused: shipping.paused, pause_reason: shipping.pause_reason, pause_note: shipping.pause_note }} />
        </div>
      </Panel>

    </div>
  );
}
