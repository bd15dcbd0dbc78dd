import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { UnitSystem } from "@/lib/calc/units";
import { formatDistance, formatQuantity } from "@/lib/format/quantity";
import { MATERIALS } from "@/lib/calc/facts";
import { materialNoun } from "@/lib/match/format";
import { formatListingQuantity } from "@/lib/listings/format";
import { formatNeedQuantity } from "@/lib/needs/units";
import type { NeedView } from "@/lib/needs/view";
import type { AlertView } from "@/lib/services/needs/list-alerts";
import { formatDay } from "@/lib/listings/format";
import { longDate } from "@/lib/time/zoned";
import { buttonClass } from "@/components/ui/button-class";
import { DismissAlert, NeedActions } from "./need-actions";
import { formatListingPrice } from "@/lib/listings/packs";

const STATUS_WORDS: Record<NeedView["status"], string> = { open: "Open", met: "Met", expired: "Past its date", closed: "Closed" };

/** One need as its owner sees it: how much, how far, by when, what is reserved, and what to do with it. */
export function NeedCard({ need, system }: { need: NeedView; system: UnitSystem }) {
  const label = `${materialNoun(need.material)}${need.bed ? ` for ${need.bed.name}` : ""}`;
  return (
    <li className="flex flex-col gap-2 rounded-lg bg-white p-4 ring-1 ring-humus-200" data-need={need.id}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold">
          {MATERIALS[need.material].name}: {formatNeedQuantity(need.quantity, need.unit, need.material, system)}
        </p>
        <span className={`rounded px-2 py-0.5 text-xs font-semibold ${need.status === "open" ? "bg-moss-100 text-moss-800" : "bg-humus-100 text-humus-700"}`}>{STATUS_WORDS[need.status]}</span>
      </div>
      <p className="text-sm text-humus-700">
        {need.bed ? (
          <>
            For{" "}
            <Link href={`/beds/${need.bed.id}`} className="text-moss-700 underline underline-offset-4">
              {need.bed.name}
            </Link>{" "}
            ·{" "}
          </>
        ) : null}
        within {formatQuantity(need.radius_km, "km", system)} · by {longDate(need.needed_by)} · {need.alerts === "daily" ? "e-mail once a day" : "e-mail at once"}
      </p>
      {need.quantity_reserved > 0 ? (
        <p className="text-sm">
          Reserved so far: {formatNeedQuantity(need.quantity_reserved, need.unit, need.material, system)}; still to find: {formatNeedQuantity(need.quantity_left, need.unit, need.material, system)}.
        </p>
      ) : null}
      <p className="text-sm text-humus-600">{need.alert_count === 0 ? "Nothing listed for it yet." : `${need.alert_count} ${need.alert_count === 1 ? "listing" : "listings"} found for it.`}</p>
      <NeedActions need={need} label={label} />
    </li>
  );
}

/** A listing found for one of the needs, with the way to reserve it. */
export function AlertCard({ alert, system }: { alert: AlertView; system: UnitSystem }) {
  const l = alert.listing;
  const price = l.price_cents > 0 ? formatListingPrice(l, system) : l.deposit_cents > 0 ? `free, ${formatMoney(l.deposit_cents, l.currency)} deposit` : "free";
  return (
    <li className={`flex flex-col gap-2 rounded-lg p-4 ring-1 ${alert.seen ? "bg-white ring-humus-200" : "bg-moss-50 ring-moss-300"}`} data-alert={alert.id}>
      <p className="font-semibold">
        {alert.seen ? null : <span className="mr-2 rounded bg-moss-600 px-2 py-0.5 text-xs font-semibold text-white">New</span>}
        {l.title}
      </p>
      <p className="text-sm text-humus-700">
        {MATERIALS[l.material].name} from {l.supplier}, {formatDistance(Math.max(0.1, l.distance_km), system)} from {alert.need.bed ? alert.need.bed.name : "your place"} ·{" "}
        {formatListingQuantity(l.quantity_available, l.unit, system)} left · {price}
        {l.reservable_from ? ` · from ${formatDay(l.reservable_from)}` : ""}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <Link href={`/needs/alerts/${alert.id}`} className={buttonClass("primary")}>
          See it and reserve
        </Link>
        <DismissAlert id={alert.id} label={l.title} />
      </div>
    </li>
  );
}
