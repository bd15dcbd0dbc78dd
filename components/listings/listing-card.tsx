import Link from "next/link";
import type { UnitSystem } from "@/lib/calc/units";
import { formatDay, formatDistance, formatListingQuantity, formatMoney, formatPrice, materialName } from "@/lib/listings/format";
import type { ListingUnit } from "@/lib/validation/listings";
import type { MaterialCode } from "@/lib/calc/facts";
import { MaterialArt } from "./material-art";
import { VerifiedBadge } from "./status-badge";

export interface CardItem {
  id: string;
  material: MaterialCode;
  title: string;
  quantity_available: number;
  unit: ListingUnit;
  price_cents: number;
  currency: string;
  deposit_cents: number;
  distance_km: number | null;
  supplier: { name: string; verified: boolean; rating?: { average: number; count: number } | null };
  photos: { url: string; width: number; height: number }[];
  available_until: string | null;
  /** Set while the listing is shown ahead of its start date. */
  reservable_from?: string | null;
}

export function ListingCard({ item, system, selected = false, onHover }: { item: CardItem; system: UnitSystem; selected?: boolean; onHover?: (id: string | null) => void }) {
  const photo = item.photos[0];
  const until = formatDay(item.available_until);
  // Listed ahead of its start: shown, but reservable only from that day.
  const from = formatDay(item.reservable_from ?? null);
  return (
    <article
      id={`listing-${item.id}`}
      className={`flex gap-3 rounded-lg bg-white p-3 ring-1 transition ${selected ? "ring-2 ring-litter-500" : "ring-humus-200"}`}
      onMouseEnter={onHover ? () => onHover(item.id) : undefined}
      onMouseLeave={onHover ? () => onHover(null) : undefined}
    >
      <div className="h-24 w-32 shrink-0 overflow-hidden rounded bg-humus-100">
        {photo ? (
          // eslint-disable-next-line @next/next/no-img-element
          <img src={photo.url} width={photo.width} height={photo.height} alt="" loading="lazy" className="h-full w-full object-cover" />
        ) : (
          <MaterialArt material={item.material} className="h-full w-full" />
        )}
      </div>
      <div className="flex min-w-0 flex-1 flex-col gap-1">
        <p className="text-xs font-semibold uppercase tracking-wide text-moss-700">{materialName(item.material)}</p>
        <h3 className="font-semibold leading-snug">
          <Link href={`/listings/${item.id}`} className="hover:underline">
            {item.title}
          </Link>
        </h3>
        <p className="text-sm text-humus-700">
          {formatListingQuantity(item.quantity_available, item.unit, system)} left · <span className="font-medium">{formatPrice(item.price_cents, item.currency, item.unit, system)}</span>
          {item.deposit_cents > 0 ? ` · ${formatMoney(item.deposit_cents, item.currency)} deposit` : ""}
        </p>
        <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm text-humus-600">
          {item.distance_km !== null ? <span>{formatDistance(item.distance_km, system)} away</span> : null}
          <span>{item.supplier.name}</span>
          {item.supplier.verified ? <VerifiedBadge /> : null}
          {item.supplier.rating ? (
            <span aria-label={`Rated ${item.supplier.rating.average.toFixed(1)} out of 5 from ${item.supplier.rating.count} review${item.supplier.rating.count === 1 ? "" : "s"}`}>
              ★ {item.supplier.rating.average.toFixed(1)} ({item.supplier.rating.count})
            </span>
          ) : null}
          {from ? <span className="font-medium text-moss-800">available from {from}</span> : null}
          {until ? <span>until {until}</span> : null}
        </p>
      </div>
    </article>
  );
}
