import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { formatQuantity } from "@/lib/format/quantity";
import { getBed } from "@/lib/services/beds/get-bed";
import { viewerUnits } from "@/lib/units/viewer";
import { PageHeading } from "@/components/ui/empty-state";
import { BedMaterials } from "@/components/match/bed-materials";

export const metadata: Metadata = { title: "Find materials" };

export default async function BedMaterialsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/beds/${id}/materials`);
  const bed = await getBed(id, user.id);
  if (!bed) notFound();
  const point = bed.lat === null || bed.lng === null ? null : { lat: Number(bed.lat), lng: Number(bed.lng) };
  return (
    <div>
      <p className="mb-2 text-sm">
        <Link href={`/beds/${bed.id}`} className="text-moss-700 underline underline-offset-4">
          ← {bed.name}
        </Link>
      </p>
      <PageHeading
        title={`Find materials for ${bed.name}`}
        lead={`A ${formatQuantity(Number(bed.area_m2), "m2", await viewerUnits(user))} bed. The nearest listings that cover it, in visiting order from the bed and back.`}
      />
      <BedMaterials bedId={bed.id} bedPoint={point} home={user.home ? { ...user.home, label: `${user.home.label} (your home place)` } : null} />
    </div>
  );
}
