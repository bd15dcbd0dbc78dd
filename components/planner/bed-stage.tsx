import { PLANT_INTO_MONTHS } from "@/lib/calc/facts";
import { bedStage, type BedMilestones } from "@/lib/calc/timeline";
import { formatDay } from "@/lib/listings/format";
import { Notice } from "@/components/ui/notice";

/** Where a saved bed stands today: not built yet, settling, ready to plant into, or mostly soil. */
export function BedStageNotice({ startDate, planting, today }: { startDate: string | null; planting: BedMilestones; today: string }) {
  if (!startDate) {
    return <Notice title="No build day yet">Give the bed a build day (Change the bed) to see when you can plant into it.</Notice>;
  }
  const months = `about ${PLANT_INTO_MONTHS.from}–${PLANT_INTO_MONTHS.until} months after building, ${PLANT_INTO_MONTHS.source}`;
  const stage = bedStage(planting, today);
  const text = {
    not_built: { title: "Not built yet", body: `Build day is ${formatDay(planting.build)}. You can plant into it from ${formatDay(planting.plant_into_from)}, ${months}.` },
    settling: { title: "Settling: not ready to plant yet", body: `You can plant into it from ${formatDay(planting.plant_into_from)}, ${months}. Keep it damp and let it sink.` },
    plant_into: {
      title: "You can plant into it now",
      body: `Set plants into pockets of compost where the layers are still coarse. Most of the material turns to soil by ${formatDay(planting.soil_by)}.`,
    },
    soil: { title: "Most of it has turned to soil", body: `Since about ${formatDay(planting.soil_by)}: sow and plant anywhere, and top it up each season.` },
  }[stage];
  return (
    <div data-stage={stage}>
      <Notice title={text.title}>{text.body}</Notice>
    </div>
  );
}
