import { ApiError } from "@/lib/api/errors";

/** A date from the form means the whole day (UTC): from its first moment, until its last. */
export function toInstant(value: string | null | undefined, edge: "start" | "end"): string | null {
  if (!value) return null;
  if (value.length === 10) return `${value}T${edge === "start" ? "00:00:00.000" : "23:59:59.999"}Z`;
  return new Date(value).toISOString();
}

/** Stored availability dates; an end already past is refused for a listing about to be on offer. */
export function listingDates(from: string | null | undefined, until: string | null | undefined, now: Date, goingLive: boolean) {
  const dates = { from: toInstant(from, "start"), until: toInstant(until, "end") };
  if (goingLive && dates.until && Date.parse(dates.until) <= now.getTime()) {
    throw new ApiError("invalid_input", "Some fields need another look.", { available_until: "That date has already passed." });
  }
  return dates;
}
