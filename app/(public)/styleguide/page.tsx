import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { isProduction } from "@/lib/env";
import { PageHeading } from "@/components/ui/empty-state";
import { StyleGuide } from "@/components/ui/style-guide";

export const metadata: Metadata = { title: "Style guide", robots: { index: false } };

// For people working on Duffbank: every primitive in components/ui on one page. Not part of
// the product, so a production build answers 404.
export default function StyleGuidePage() {
  if (isProduction()) notFound();
  return (
    <div>
      <PageHeading title="Style guide" lead="The parts every Duffbank screen is built from, in the palette from tailwind.config.ts. Development only." />
      <StyleGuide />
    </div>
  );
}
