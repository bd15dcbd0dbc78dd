"use client";
import Link from "next/link";
import { useState } from "react";
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { DEFAULT_RADIUS_KM, MAX_RADIUS_KM } from "@/lib/match/defaults";
import type { LatLng, Need } from "@/lib/match/types";
import { matchSchema, needsToParam, type MatchRequest } from "@/lib/validation/match";
import { DEFAULT_CENTER } from "@/components/map/types";
import { Button } from "@/components/ui/button";
import { buttonClass } from "@/components/ui/button-class";
import { MeasureField } from "@/components/ui/measure-field";
import { radiusHint, radiusProblem } from "@/lib/match/format";
import { Notice } from "@/components/ui/notice";
import { PlanPanel } from "./plan-panel";
import { replaceNeed } from "./replace-need";
import { useMatch } from "./use-match";
import { Form } from "@/components/ui/form";
import { PlaceSearch, type ChosenPlace } from "@/components/ui/place-search";
import { usePointName } from "@/components/ui/use-point-name";
import { useUnits } from "@/components/ui/units-context";

/** "Find materials" for a saved bed: its own needs and point, a radius to try, and the plan. */
export function BedMaterials({ bedId, bedPoint, home }: { bedId: string; bedPoint: LatLng | null; home: ChosenPlace | null }) {
  const { system } = useUnits();
  // The plan starts at once from the bed's own place, or else from the gardener's home place.
  const first: ChosenPlace | null = bedPoint ? { ...bedPoint, label: "The bed" } : home;
  const [start, setStart] = useState<LatLng | null>(first);
  const [startPlace, setStartPlace] = useState<ChosenPlace | null>(first);
  const nameOf = usePointName();
  const [radius, setRadius] = useState(String(DEFAULT_RADIUS_KM));
  const [radiusError, setRadiusError] = useState<string | undefined>();
  const [needs, setNeeds] = useState<Need[] | null>(null);
  const [request, setRequest] = useState<MatchRequest | null>(
    bedPoint ? { bed_id: bedId, radius_km: DEFAULT_RADIUS_KM } : home ? { bed_id: bedId, radius_km: DEFAULT_RADIUS_KM, origin: { lat: home.lat, lng: home.lng } } : null,
  );
  const query = useMatch(request);
  const plan = query.data;

  const run = (over: { radius_km?: number; needs?: Need[] | null; origin?: LatLng | null } = {}) => {
    const origin = over.origin === undefined ? start : over.origin;
    const chosen = over.needs === undefined ? needs : over.needs;
    const body = { bed_id: bedId, radius_km: over.radius_km ?? Number(radius), ...(chosen ? { needs: chosen } : {}), ...(origin && origin !== bedPoint ? { origin } : {}) };
    // The same schema as the handler, so the message here is the one the server would give.
    const parsed = matchSchema.safeParse(body);
    if (!parsed.success) {
      const issue = parsed.error.issues.find((i) => i.path[0] === "radius_km") ?? parsed.error.issues[0];
      setRadiusError(issue.path[0] === "radius_km" ? radiusProblem(system) : issue.message);
      return;
    }
    setRadiusError(undefined);
    setRequest(body);
  };

  const widen = (km: number) => {
    setRadius(String(km));
    run({ radius_km: km });
  };
  const substitute = (short: Need, material: MaterialCode) => {
    const next = replaceNeed(needs ?? plan?.needs ?? [], short, material);
    setNeeds(next);
    run({ needs: next });
  };
  const pick = async (p: LatLng, label?: string) => {
    const next = { lat: Number(p.lat.toFixed(6)), lng: Number(p.lng.toFixed(6)) };
    setStart(next);
    run({ origin: next });
    setStartPlace({ ...next, label: label ?? (await nameOf(next, "Point on the map")) });
  };

  const shown = plan?.needs ?? needs ?? [];
  const origin = plan?.origin ?? start ?? DEFAULT_CENTER;
  const editHref = `/match?${new URLSearchParams({ lat: String(origin.lat), lng: String(origin.lng), radius_km: radius, needs: needsToParam(shown) })}`;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
      <aside className="flex flex-col gap-4 rounded-leaf bg-white p-5 ring-1 ring-humus-200">
        <section aria-labelledby="needs-title">
          <h2 id="needs-title" className="text-lg font-semibold">
            What this bed needs
          </h2>
          {shown.length ? (
            <ul className="mt-2 flex flex-col gap-1">
              {shown.map((n) => (
                <li key={n.material} className="flex justify-between gap-2">
                  <span>{MATERIALS[n.material].name}</span>
                  <span className="whitespace-nowrap font-medium">{formatQuantity(n.quantity, n.unit, system)}</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-2 text-humus-600">Worked out from the bed&apos;s size and layers when the plan loads.</p>
          )}
          {needs ? <p className="mt-2 text-sm text-humus-600">Changed from the bed&apos;s own list for this search.</p> : null}
          <Link href={editHref} className={`${buttonClass("quiet")} mt-2 inline-block text-sm`}>
            Change these amounts in the planner
          </Link>
        </section>
        <Form
          onSubmit={(e) => {
            e.preventDefault();
            run();
          }}
          noValidate
          className="flex flex-col gap-2"
        >
          <MeasureField label="Look within" name="radius_km" unit="km" system={system} max={MAX_RADIUS_KM} value={Number(radius)} onChange={(km) => setRadius(String(km))} error={radiusError} hint={radiusHint(system)} />
          <Button type="submit" disabled={query.isFetching || !start}>
            {query.isFetching ? "Finding…" : "Find materials"}
          </Button>
        </Form>
        <PlaceSearch label="Start from" name="origin" hint={bedPoint ? "The bed's own place, unless you start from somewhere else." : "This bed has no place of its own yet: a street, village or postcode."} value={startPlace} onChange={(p) => void pick(p, p.label)} />
        {!bedPoint && !home ? <Notice tone="caution">This bed has no place yet: find where you start from above, or tap the map.</Notice> : null}
      </aside>
      <PlanPanel title="Pickup plan" query={query} origin={origin} system={system} onPick={pick} onWiden={widen} onSubstitute={substitute} bedId={bedId} />
    </div>
  );
}
