import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/empty-state";
import { MixCalculator } from "@/components/mix/mix-calculator";

export const metadata: Metadata = { title: "Mix calculator" };

export default function MixPage() {
  return (
    <div>
      <PageHeading title="Mix calculator" lead="For composters who weigh things: the carbon-to-nitrogen ratio and moisture of any mix, and how much water brings it to your target." />
      <MixCalculator />
    </div>
  );
}
