import "server-only";
import { boundingBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";
import { slotsOf, upcomingDays } from "@/db/giveaways";
import { organisationNames } from "@/db/listings";
import { addDays, localDate } from "@/lib/time/zoned";
import { publicDayView, type PublicDayView } from "@/lib/giveaways/view";
import { resolveContext, type Context } from "@/lib/context";

/** Upcoming giveaway days, nearest first within each date when a point is given. */
export async function searchGiveaways(
  query: { lat?: number; lng?: number; radius_km: number },
  ctx: Context = {},
): Promise<PublicDayView[]> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const hasPoint = query.lat !== undefined && query.lng !== undefined;
  const box = hasPoint ? boundingBox({ lat: query.lat!, lng: query.lng! }, query.radius_km) : undefined;
  // A day behind UTC still counts as today somewhere west, so the query starts a day early
  // and each day is then judged by its own zone's calendar.
  const rows = (await upcomingDays({ fromDate: addDays(now.toISOString().slice(0, 10), -1), box }, q)).filter((d) => d.date >= localDate(now, d.time_zone));
  const [slots, names] = await Promise.all([slotsOf(rows.map((r) => r.id), q), organisationNames(rows.map((r) => r.organisation_id), q)]);
  const items = rows.map((d) => {
    const view = publicDayView(d, slots, names.get(d.organisation_id) ?? "");
    if (hasPoint) view.distance_km = Math.round(distanceKm({ lat: query.lat!, lng: query.lng! }, { lat: d.approx_lat, lng: d.approx_lng }) * 10) / 10;
    return view;
  });
  const within = hasPoint ? items.filter((i) => i.distance_km! <= query.radius_km) : items;
  return within.sort((a, b) => a.date.localeCompare(b.date) || (a.distance_km ?? 0) - (b.distance_km ?? 0));
}
