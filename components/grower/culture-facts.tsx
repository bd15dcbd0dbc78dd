import { dayLabel } from "@/lib/reservations/culture-orders";
import type { CultureOffer } from "@/lib/services/growers/get-culture-offer";
import { ShippingNotice } from "./shipping-notice";

/** A live culture as a buyer weighs it up: how many worms, which species, and how they reach you. */
export function CultureFacts({ culture, headingLevel = 2 }: { culture: CultureOffer; headingLevel?: 2 | 3 }) {
  const H = headingLevel === 2 ? "h2" : "h3";
  const ways = [culture.pickup ? "Collect from the grower" : null, culture.ships ? "Posted to you" : null].filter(Boolean).join(" or ");
  return (
    <section aria-labelledby="culture-title" className="flex flex-col gap-3 rounded-lg bg-white p-4 ring-1 ring-humus-200" data-testid="culture-facts">
      <H id="culture-title" className="font-semibold">
        Live culture
      </H>
      <dl className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-humus-600">Roughly</dt>
          <dd className="font-medium">
            {culture.estimated_count.toLocaleString("en-GB")} worms left
            <span className="block font-normal text-humus-600">about 1,000 a pound: an estimate, not a count</span>
          </dd>
        </div>
        <div>
          <dt className="text-humus-600">Species</dt>
          <dd className="font-medium italic">{culture.species ?? "Not named yet: ask the grower before you order"}</dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="text-humus-600">How it reaches you</dt>
          <dd className="font-medium">{ways}</dd>
        </div>
      </dl>
      {culture.ships ? (
        culture.shipping.paused ? (
          <ShippingNotice shipping={culture.shipping} />
        ) : (
          <p className="rounded-lg border-l-4 border-moss-300 bg-moss-50 p-3 text-sm text-moss-900" data-testid="posting-days">
            {culture.shipping.notice}
            {culture.next_posting_day ? ` An order today goes out on ${dayLabel(culture.next_posting_day)} at the earliest.` : ""}
          </p>
        )
      ) : (
        <p className="text-sm text-humus-700">Not posted: collection only.</p>
      )}
    </section>
  );
}
