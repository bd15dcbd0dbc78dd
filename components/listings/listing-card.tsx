import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { UnitSystem, ListingUnit } from "@/lib/calc/units";
import { formatDay, formatListingQuantity, materialName } from "@/lib/listings/format";
import { formatDistance } from "@/lib/format/quantity";
import type { MaterialCode } from "@/lib/calc/facts";
import { TrustMarks } from "./trust-marks";
import { UnitDrawing } from "./unit-drawing";
import { formatListingPrice, packCount, wholePacks, type Pack } from "@/lib/listings/packs";

export interface CardItem {
  id: string;
  material: MaterialCode;
  title: string;
  quantity_available: number;
  unit: ListingUnit;
  unit_size?: number | null;
  unit_mass_kg?: number | null;
  price_cents: number;
  pack?: Pack | null;
  currency: string;
  deposit_cents: number;
  distance_km: number | null;
  supplier: { name: string; verified: boolean; rating?: { average: number; count: number } | null; collections?: number };
  photos: { url: string; width: number; height: number }[];
  available_until: string | null;
  /** Set while the listing is shown ahead of its start date. */
  reservable_from?: string | null;
}

/**
 * One listing, led by what it is and how much is left (drawn as the bags, bales or sheets
 * it comes in), then how far, what it costs, when, and who offers it. `fit` is the line
 * saying how much of the chosen bed's need it covers.
 */
export function ListingCard({ item, system, selected = false, fit, onHover }: { item: CardItem; system: UnitSystem; selected?: boolean; fit?: string | null; onHover?: (id: string | null) => void }) {
  const photo = item.photos[0];
  const until = formatDay(item.available_until);
  // Listed ahead of its start: shown, but reservable only from that day.
  const from = formatDay(item.reservable_from ?? null);
  return (
    <article
      id={`listing-${item.id}`}
      data-material={item.material}
      className={`grid gap-x-4 gap-y-2 rounded-leaf bg-white p-4 ring-1 transition sm:grid-cols-[minmax(0,11rem)_minmax(0,1fr)] ${selected ? "ring-2 ring-litter-500" : "ring-humus-200"}`}
      onMouseEnter={onHover ? () => onHover(item.id) : undefined}
      onMouseLeave={onHover ? () => onHover(null) : undefined}
    >
      <div className="flex items-start justify-between gap-3 sm:row-span-4 sm:flex-col sm:justify-start">
        <div className="flex min-w-0 flex-col gap-1">
          <p className="text-sm font-semibold text-moss-800" data-testid="card-material">
            {materialName(item.material)}
          </p>
          <p className="text-2xl font-bold leading-tight text-humus-900">{formatListingQuantity(item.quantity_available, item.unit, system)} left{item.pack ? ` (${packCount(wholePacks(item.quantity_available, item.pack))})` : ""}</p>
          <UnitDrawing material={item.material} unit={item.unit} amount={item.quantity_available} />
        </div>
        {photo ? (
          // eslint-disable-next-line @next/next/no-img-element
          <img src={photo.url} width={photo.width} height={photo.height} alt="" loading="lazy" className="h-16 w-20 shrink-0 rounded-lg object-cover ring-1 ring-humus-200" />
        ) : null}
      </div>
      {fit ? (
        <p className="self-start rounded-lg bg-litter-100 px-2.5 py-1 text-sm font-semibold text-humus-900 ring-1 ring-litter-300" data-testid="fit">
          {fit}
        </p>
      ) : null}
      <h3 className="font-semibold leading-snug">
        <Link href={`/listings/${item.id}`} className="underline-offset-4 hover:underline">
          {item.title}
        </Link>
      </h3>
      <p className="flex flex-wrap gap-x-2 text-sm text-humus-700">
        {item.distance_km !== null ? <span className="font-medium">{formatDistance(item.distance_km, system)} away</span> : null}
        <span className="font-medium">{formatListingPrice(item, system)}</span>
        {item.deposit_cents > 0 ? <span>{formatMoney(item.deposit_cents, item.currency)} back when you collect</span> : null}
        {from ? <span className="font-medium text-moss-800">collect from {from}</span> : null}
        {until ? <span>until {until}</span> : null}
      </p>
      <p className="flex flex-wrap items-center gap-x-2 text-sm text-humus-700">
        <span>{item.supplier.name}</span>
        <TrustMarks supplier={item.supplier} />
      </p>
    </article>
  );
}
