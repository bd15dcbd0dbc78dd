import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { DEFAULT_RADIUS_KM, MAX_RADIUS_KM } from "@/lib/match/defaults";
import { needsFromParam, type MatchRequest } from "@/lib/validation/match";
import { PageHeading } from "@/components/ui/empty-state";
import { MatchPlanner } from "@/components/match/match-planner";

export const metadata: Metadata = { title: "Find materials" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const num = (v: string | string[] | undefined) => {
  const s = one(v);
  const n = s === undefined || s.trim() === "" ? NaN : Number(s);
  return Number.isFinite(n) ? n : undefined;
};

// /match?lat=52.2&lng=0.85&radius_km=15&needs=leaves:0.45:m3,cardboard:3.6:m2
export default async function MatchPage({ searchParams }: { searchParams: Promise<Search> }) {
  const params = await searchParams;
  const user = await currentUser();
  const { needs, skipped } = needsFromParam(one(params.needs));
  const lat = num(params.lat);
  const lng = num(params.lng);
  const radius = num(params.radius_km);
  const fromUrl = lat !== undefined && lng !== undefined;
  // Needs with no start in the link: a signed-in gardener starts from their home place.
  const home = !fromUrl ? (user?.home ?? null) : null;
  const start = fromUrl ? { lat, lng } : home ? { lat: home.lat, lng: home.lng } : null;
  const initial: MatchRequest = {
    needs: needs.length ? needs : [{ material: "leaves", quantity: 0.45, unit: "m3" }],
    ...(start ? { origin: start } : {}),
    radius_km: radius !== undefined && radius > 0 ? Math.min(radius, MAX_RADIUS_KM) : DEFAULT_RADIUS_KM,
  };
  const placeParam = one(params.place)?.trim().slice(0, 200) || null;
  const startLabel = fromUrl ? (placeParam ?? "The point in the link") : home ? `${home.label} (your home place)` : null;
  return (
    <div>
      <PageHeading
        title="Find the materials"
        lead="Say what your bed needs and where you start from. Duffbank finds nearby listings that cover it, in as few, short and cheap pickups as it can, and draws the round trip."
      />
      <MatchPlanner initial={initial} run={needs.length > 0 && start !== null} skipped={skipped} startLabel={startLabel} />
    </div>
  );
}
