import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { localDate, addDays } from "@/lib/time/zoned";
import { PageHeading } from "@/components/ui/empty-state";
import { DayForm } from "@/components/giveaways/day-form";
import { defaultDayValues } from "@/components/giveaways/day-form-model";

export const metadata: Metadata = { title: "New giveaway day" };

export default async function NewGiveawayPage() {
  await pageUser("/council/giveaways/new", ["council"]);
  const inAWeek = addDays(localDate(new Date(), "Europe/London"), 7);
  return (
    <div>
      <PageHeading title="New giveaway day" lead="Set the material, the place, the time slots and how much each household may take. Residents book from the public giveaway page." />
      <DayForm mode="create" initial={defaultDayValues(inAWeek)} />
    </div>
  );
}
