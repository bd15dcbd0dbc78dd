import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { localDate, addDays } from "@/lib/time/zoned";
import { PageHeading } from "@/components/ui/empty-state";
import { DayForm } from "@/components/giveaways/day-form";
import { defaultDayValues, suggestedDayValues } from "@/components/giveaways/day-form-model";

export const metadata: Metadata = { title: "New giveaway day" };

export default async function NewGiveawayPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await pageUser("/council/giveaways/new", ["council"]);
  const inAWeek = addDays(localDate(new Date(), "Europe/London"), 7);
  // Coming from the demand map's suggestion: its material, date, place and slots filled in.
  const initial = suggestedDayValues(defaultDayValues(inAWeek), await searchParams);
  return (
    <div>
      <PageHeading title="New giveaway day" lead="Set the material, the place, the time slots and how much each household may take. Residents book from the public giveaway page." />
      <DayForm mode="create" initial={initial} />
    </div>
  );
}
