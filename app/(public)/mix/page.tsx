import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/empty-state";
import { MixCalculator } from "@/components/mix/mix-calculator";

export const metadata: Metadata = { title: "Mix a pile" };

export default function MixPage() {
  return (
    <div>
      <PageHeading
        title="Mix a pile"
        lead="Pick what you have, say how much in the buckets, barrows, bags or bales you have it in, and see whether the browns and greens balance and how wet the pile will be."
      />
      <MixCalculator />
    </div>
  );
}
