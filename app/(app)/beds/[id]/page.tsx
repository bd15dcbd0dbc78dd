import Link from "next/link";
import { notFound } from "next/navigation";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { getBed } from "@/lib/services/beds/get-bed";
import { toBedView } from "@/lib/beds/view";
import { savedBedEstimate } from "@/lib/services/beds/estimate-saved-bed";
import { PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { BedEstimate } from "@/components/planner/bed-estimate";
import { BedStageNotice } from "@/components/planner/bed-stage";
import { DeleteBedButton } from "@/components/planner/delete-bed-button";
import { viewerUnits } from "@/lib/units/viewer";
import { formatQuantity } from "@/lib/format/quantity";

export const metadata: Metadata = { title: "Bed" };

export default async function BedPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/beds/${id}`, ["gardener"]);
  const row = await getBed(id, user.id);
  if (!row) notFound();
  const bed = toBedView(row);
  const system = await viewerUnits(user);
  const result = await savedBedEstimate(bed, system);
  const today = new Date().toISOString().slice(0, 10);
  const size = "length_m" in bed.shape
    ? `${formatQuantity(bed.shape.length_m, "m", system)} × ${formatQuantity(bed.shape.width_m, "m", system)}`
    : "drawn outline";
  return (
    <div>
      <PageHeading title={bed.name} lead={`${size}, ${formatQuantity(bed.area_m2, "m2", system)}${bed.start_date ? ` · build day ${bed.start_date}` : ""}`} />
      <div className="mb-6 flex flex-wrap gap-3">
        <Link className={buttonClass()} href={`/beds/${bed.id}/materials`}>
          Find materials for this bed
        </Link>
        <a className={buttonClass("secondary")} href={`/api/beds/${bed.id}/calendar.ics`} download>
          Add the timeline to my calendar (.ics)
        </a>
        <Link className={buttonClass("secondary")} href={`/beds/${bed.id}/edit`}>
          Change the bed
        </Link>
        <DeleteBedButton id={bed.id} name={bed.name} />
      </div>
      <div className="mb-6">
        <BedStageNotice startDate={bed.start_date} planting={result.planting} today={today} />
      </div>
      <p className="mb-6 text-sm text-humus-700">
        We e-mail you on each date of the timeline{" "}
        <Link href="/profile" className="text-moss-700 underline">
          (turn reminders off on your profile)
        </Link>
        .
      </p>
      <BedEstimate result={result} system={system} />
    </div>
  );
}
