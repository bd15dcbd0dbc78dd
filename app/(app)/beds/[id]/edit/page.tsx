import { notFound } from "next/navigation";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { getBed } from "@/lib/services/beds/get-bed";
import { toBedView } from "@/lib/beds/view";
import { PageHeading } from "@/components/ui/empty-state";
import { PlanForm } from "@/components/planner/plan-form";
import { valuesFromBed } from "@/components/planner/form-model";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Change a bed" };

export default async function EditBedPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/beds/${id}/edit`, ["gardener"]);
  const system = await viewerUnits(user);
  const row = await getBed(id, user.id);
  if (!row) notFound();
  const bed = toBedView(row);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div>
      <PageHeading title={`Change ${bed.name}`} lead="Adjust the size or the layers, work it out again, then save." />
      <PlanForm system={system} today={today} canSave bed={{ id: bed.id, name: bed.name, values: valuesFromBed(bed, system, today) }} />
    </div>
  );
}
