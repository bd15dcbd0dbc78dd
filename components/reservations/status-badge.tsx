import { STATUS_LABELS, type ReservationStatus } from "@/lib/reservations/policy";

const TONE: Record<ReservationStatus, string> = {
  held: "bg-litter-100 text-litter-700 ring-litter-300",
  confirmed: "bg-moss-100 text-moss-800 ring-moss-300",
  collected: "bg-moss-600 text-white ring-moss-700",
  declined: "bg-humus-100 text-humus-700 ring-humus-300",
  cancelled: "bg-humus-100 text-humus-700 ring-humus-300",
  expired: "bg-humus-100 text-humus-700 ring-humus-300",
  no_show: "bg-ember-100 text-ember-800 ring-ember-600",
};

export function StatusBadge({ status }: { status: ReservationStatus }) {
  return <span className={`inline-flex items-center rounded-full px-3 py-1 text-sm font-semibold ring-1 ${TONE[status]}`}>{STATUS_LABELS[status]}</span>;
}
