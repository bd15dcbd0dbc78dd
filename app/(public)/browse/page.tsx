import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { browseListings } from "@/lib/services/browse-listings";
import { browseParams, browseQuerySchema } from "@/lib/validation/listings";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { BrowseView } from "@/components/listings/browse-view";
import { BROWSE_PAGE, filtersFrom } from "@/components/listings/browse-filters";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Find material" };

export default async function BrowsePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { cursor: _cursor, limit: _limit, ...raw } = browseParams(await searchParams);
  const parsed = browseQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : {};
  const [page, user] = await Promise.all([browseListings({ ...query, limit: BROWSE_PAGE }), currentUser()]);
  return (
    <div>
      <PageHeading
        title="Find material"
        lead="Leaves, board, bales, grounds, chips and worms that people near you have spare. Pick a distance to see the nearest first."
      />
      {parsed.success ? null : (
        <div className="mb-4">
          <Notice tone="caution">Part of that link did not make sense to us, so it shows everything on offer instead.</Notice>
        </div>
      )}
      <BrowseView initial={{ filters: filtersFrom(query), page }} system={await viewerUnits(user)} />
    </div>
  );
}
