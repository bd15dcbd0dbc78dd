"use client";
import { useEffect, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { usePathname, useRouter } from "next/navigation";
import type { MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import type { Need } from "@/lib/match/types";
import { matchSchema, needsToParam, type MatchInput, type MatchRequest } from "@/lib/validation/match";
import { DEFAULT_CENTER } from "@/components/map/types";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { NeedsForm } from "./needs-form";
import { PlanPanel } from "./plan-panel";
import { replaceNeed } from "./replace-need";
import { useMatch } from "./use-match";
import type { ChosenPlace } from "@/components/ui/place-search";
import { usePointName } from "@/components/ui/use-point-name";
import { useUnits } from "@/components/ui/units-context";

const finite = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

/** The public planner: needs from the URL or the form, a start point picked on the map, and the plan. */
export function MatchPlanner({
  initial,
  run,
  skipped,
  startLabel,
}: {
  initial: MatchRequest;
  run: boolean;
  skipped: number;
  /** What the start in `initial` is called ("Orchard Rise, Fernhollow"); null when none was given. */
  startLabel: string | null;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const { system } = useUnits();
  const [request, setRequest] = useState<MatchRequest | null>(null);
  const [place, setPlace] = useState<ChosenPlace | null>(startLabel && initial.origin ? { ...initial.origin, label: startLabel } : null);
  const nameOf = usePointName();
  const form = useForm<MatchRequest, unknown, MatchInput>({ resolver: zodResolver(matchSchema), defaultValues: initial, mode: "onSubmit" });
  const query = useMatch(request);

  const submit = form.handleSubmit((v) => {
    const next = { needs: v.needs, origin: v.origin, radius_km: v.radius_km };
    const params = new URLSearchParams({ lat: String(v.origin!.lat), lng: String(v.origin!.lng), radius_km: String(v.radius_km), needs: needsToParam(v.needs ?? []), ...(place ? { place: place.label } : {}) });
    router.replace(`${pathname}?${params}`, { scroll: false });
    setRequest(next);
  });

  useEffect(() => {
    if (run) void submit();
    // Only the needs that came in the URL run by themselves, once.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const watched = useWatch({ control: form.control, name: "origin" });
  const origin = watched && finite(watched.lat) && finite(watched.lng) ? { lat: watched.lat, lng: watched.lng } : DEFAULT_CENTER;

  const pick = async (p: { lat: number; lng: number }) => {
    const point = { lat: Number(p.lat.toFixed(6)), lng: Number(p.lng.toFixed(6)) };
    form.setValue("origin", point, { shouldValidate: form.formState.isSubmitted });
    setPlace({ ...point, label: await nameOf(point, "Point on the map") });
  };
  const widen = (km: number) => {
    form.setValue("radius_km", km);
    void submit();
  };
  const substitute = (short: Need, material: MaterialCode) => {
    form.reset({ ...form.getValues(), needs: replaceNeed((form.getValues("needs") ?? []) as Need[], short, material) });
    void submit();
  };

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <aside className="rounded-leaf bg-white p-5 ring-1 ring-humus-200">
        {skipped > 0 ? (
          <div className="mb-3">
            <Notice tone="caution">{skipped === 1 ? "One need in the link could not be read and was left out." : `${skipped} needs in the link could not be read and were left out.`}</Notice>
          </div>
        ) : null}
        <NeedsForm form={form} system={system} onSubmit={submit} busy={query.isFetching} place={place} onPlace={setPlace} />
      </aside>
      <PlanPanel
        title="Your pickup plan"
        query={query}
        origin={origin}
        system={system}
        onPick={pick}
        onWiden={widen}
        onSubstitute={substitute}
        empty={
          request ? null : (
            <EmptyState title="Tell us what the bed needs">
              Add each material and how much of it, say where you start from (a street, village or postcode, or tap the map), and we will find the nearby listings that cover it with the fewest, shortest, cheapest pickups.
            </EmptyState>
          )
        }
      />
    </div>
  );
}
