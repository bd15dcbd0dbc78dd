import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { PageHeading } from "@/components/ui/empty-state";
import { PlanForm } from "@/components/planner/plan-form";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Plan a bed" };

export default async function PlanPage() {
  const user = await currentUser();
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div>
      <PageHeading
        title="Plan a bed"
        lead="Cardboard on the ground, leaves on the cardboard, straw on top, a good soak, and worms a week or two later. Tell us the size and we will work out the rest."
      />
      <PlanForm system={await viewerUnits(user)} today={today} canSave={!!user?.roles.includes("gardener")} home={user?.home ?? null} />
    </div>
  );
}
