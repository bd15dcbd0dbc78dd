import { STATUS_LABELS } from "@/lib/listings/format";
import { Badge, type BadgeTone } from "@/components/ui/badge";

const TONE: Record<string, BadgeTone> = {
  active: "moss",
  draft: "humus",
  paused: "litter",
  gone: "humus",
  expired: "humus",
  archived: "humus",
  hidden: "ember",
};

export function StatusBadge({ status }: { status: string }) {
  return <Badge tone={TONE[status] ?? "humus"}>{STATUS_LABELS[status] ?? status}</Badge>;
}
