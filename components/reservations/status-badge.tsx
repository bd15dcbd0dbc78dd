import { STATUS_LABELS, type ReservationStatus } from "@/lib/reservations/policy";
import { Badge, type BadgeTone } from "@/components/ui/badge";

const TONE: Record<ReservationStatus, BadgeTone> = {
  held: "litter",
  confirmed: "moss",
  collected: "solid",
  declined: "humus",
  cancelled: "humus",
  expired: "humus",
  no_show: "ember",
};

export function StatusBadge({ status }: { status: ReservationStatus }) {
  return (
    <Badge tone={TONE[status]} className="font-semibold">
      {STATUS_LABELS[status]}
    </Badge>
  );
}
