// A need as its owner sees it. The only shape of a need that leaves the server, and only to
// the person who opened it: others see aggregates (lib/needs/demand.ts), never this.
import type { NeedRow, NeedStatus } from "@/db/types";
import type { MaterialCode } from "@/lib/calc/facts";
import type { NeedUnit } from "@/lib/match/types";
import type { Coverage } from "./coverage";

export interface NeedView {
  id: string;
  material: MaterialCode;
  /** SI, in `unit`. */
  quantity: number;
  unit: NeedUnit;
  /** Held, confirmed or collected through reservations, in `unit`. */
  quantity_reserved: number;
  quantity_left: number;
  radius_km: number;
  needed_by: string;
  location: { lat: number; lng: number };
  bed: { id: string; name: string } | null;
  alerts: "daily" | "immediate";
  status: NeedStatus;
  alert_count: number;
  created_at: string;
  closed_at: string | null;
}

const round = (x: number) => Math.round(x * 1e6) / 1e6;

/** A need still marked open after its day is expired already: reads agree before the worker writes it. */
export function effectiveNeedStatus(n: Pick<NeedRow, "status" | "needed_by">, today: string): NeedStatus {
  return n.status === "open" && n.needed_by < today ? "expired" : n.status;
}

export function presentNeed(n: NeedRow, extra: { coverage: Coverage; bedName: string | null; alertCount: number }, today: string): NeedView {
  const reserved = round(extra.coverage.reserved);
  return {
    id: n.id,
    material: n.material_code,
    quantity: Number(n.quantity),
    unit: n.unit,
    quantity_reserved: reserved,
    quantity_left: Math.max(0, round(Number(n.quantity) - reserved)),
    radius_km: Number(n.radius_km),
    needed_by: n.needed_by,
    location: { lat: Number(n.lat), lng: Number(n.lng) },
    bed: n.bed_id && extra.bedName ? { id: n.bed_id, name: extra.bedName } : null,
    alerts: n.alerts,
    status: effectiveNeedStatus(n, today),
    alert_count: extra.alertCount,
    created_at: n.created_at,
    closed_at: n.closed_at,
  };
}
