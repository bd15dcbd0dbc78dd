import "server-only";
import type { ListingRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { quantityLeft } from "@/lib/listings/status";
import { formatDay, formatListingQuantity, materialName } from "@/lib/listings/format";
import type { AlertLine } from "@/lib/mail/templates/need-alerts";
import type { ListingUnit } from "@/lib/match/types";

/** The words of one alert for its reader. */
export function alertLine(
  l: Pick<ListingRow, "material_code" | "title" | "unit" | "quantity_total" | "quantity_held" | "quantity_collected" | "available_from">,
  supplier: string,
  alert: { id: string; distance_km: number },
  bedName: string | null,
  system: UnitSystem,
  now: Date,
): AlertLine {
  return {
    material: materialName(l.material_code),
    listingTitle: l.title,
    supplier,
    distance: formatQuantity(Math.max(0.1, alert.distance_km), "km", system),
    forWhat: bedName ? `for ${bedName}` : "",
    left: `${formatListingQuantity(quantityLeft(l), l.unit as ListingUnit, system)} left`,
    from: l.available_from && Date.parse(l.available_from) > now.getTime() ? `from ${formatDay(l.available_from)}` : "",
    url: `${appUrl()}/needs/alerts/${alert.id}`,
  };
}
