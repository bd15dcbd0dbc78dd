"use client";
import Link from "next/link";
import { useState } from "react";
import type { UnitSystem } from "@/lib/calc/units";
import { materialNoun } from "@/lib/match/format";
import type { Need } from "@/lib/match/types";
import { formatNeedQuantity } from "@/lib/needs/units";
import { longDate } from "@/lib/time/zoned";
import { Button } from "@/components/ui/button";
import { needFormValues } from "./need-form-values";
import { OpenNeedForm } from "./open-need-form";
import { useBedNeeds, useNeedsChanged } from "./use-needs";

/**
 * Beside a bed's unmet material: turn it into an open need, so the gardener is told when
 * someone lists it nearby; or say that one is already open.
 */
export function AskForIt({ bedId, need, radiusKm, system }: { bedId: string; need: Need; radiusKm: number; system: UnitSystem }) {
  const [open, setOpen] = useState(false);
  const watching = useBedNeeds(bedId);
  const changed = useNeedsChanged();
  const existing = watching.data?.find((n) => n.material === need.material && n.status === "open");
  if (existing) {
    return (
      <p className="text-sm text-moss-800" data-open-need={need.material}>
        You have an open need for {formatNeedQuantity(existing.quantity, existing.unit, existing.material, system)} of {materialNoun(need.material)} until {longDate(existing.needed_by)}: we tell you when it is listed.{" "}
        {existing.alert_count > 0 ? `${existing.alert_count === 1 ? "One listing" : `${existing.alert_count} listings`} within your reach could serve it already. ` : ""}
        <Link href="/needs" className="font-medium underline underline-offset-4">
          {existing.alert_count > 0 ? "See them in your needs" : "Your needs"}
        </Link>
      </p>
    );
  }
  if (!open) {
    return (
      <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
        Tell me when someone lists {materialNoun(need.material)} nearby
      </Button>
    );
  }
  return (
    <div className="rounded-lg bg-white p-3 ring-1 ring-humus-200">
      <OpenNeedForm system={system} fixed initial={needFormValues(system, { material: need.material, quantity: need.quantity, unit: need.unit, radius_km: radiusKm, bed_id: bedId })} onOpened={() => void changed()} />
    </div>
  );
}
