import { formatMoney } from "@/lib/format/money";

// How a giveaway booking's no-show deposit reads, to the household and to staff. The states
// are those of lib/services/giveaways/steps/giveaway-deposit.ts.
const STATE: Record<string, string> = {
  none: "",
  awaiting: "not put down yet",
  held: "on hold on the card",
  released: "released",
  kept: "kept for the no-show",
  unpaid: "never put down",
};

export function depositStateLabel(status: string): string {
  return STATE[status] ?? status;
}

/** "€5.00 on hold on the card", or "" for a booking without a deposit. */
export function depositLabel(cents: number, currency: string, status: string): string {
  if (!(cents > 0) || status === "none") return "";
  return `${formatMoney(cents, currency)} ${depositStateLabel(status)}`;
}
