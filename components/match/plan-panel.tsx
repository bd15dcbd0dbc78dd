"use client";
import type { ReactNode } from "react";
import type { MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import type { LatLng, Need } from "@/lib/match/types";
import { Spinner } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { PickupPlan } from "./pickup-plan";
import { PlanMap } from "./plan-map";
import { UnitSwitch } from "@/components/ui/unit-switch";
import type { useMatch } from "./use-match";

/** The right-hand side of both planners: the map, the states of the request, and the plan. */
export function PlanPanel(props: {
  title: string;
  query: ReturnType<typeof useMatch>;
  origin: LatLng;
  system: UnitSystem;
  onPick: (p: LatLng) => void;
  onWiden: (km: number) => void;
  onSubstitute: (need: Need, material: MaterialCode) => void;
  bedId?: string;
  empty?: ReactNode;
}) {
  const { query, system } = props;
  const plan = query.data;
  return (
    <section aria-labelledby="plan-title" className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="plan-title" className="text-2xl font-bold">
          {props.title}
        </h2>
        <UnitSwitch />
      </div>
      <PlanMap origin={plan?.origin ?? props.origin} stops={plan?.stops ?? []} onPick={props.onPick} />
      {query.isFetching ? <Spinner label="Finding the nearest supplies" /> : null}
      {query.isError ? (
        <Notice tone="error" title="No plan this time">
          {(query.error as Error).message}
        </Notice>
      ) : null}
      {!plan && !query.isFetching && !query.isError ? props.empty : null}
      {plan && !query.isFetching ? <PickupPlan plan={plan} system={system} bedId={props.bedId} onWiden={props.onWiden} onSubstitute={props.onSubstitute} /> : null}
    </section>
  );
}
