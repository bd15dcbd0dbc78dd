import type { Metadata } from "next";
import { currentUser } from "@/lib/auth/current-user";
import { browseListings } from "@/lib/services/listings/browse-listings";
import { bedsStillNeed } from "@/lib/services/beds/list-beds-still-needing";
import { browseParams, browseQuerySchema } from "@/lib/validation/listings";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { BrowseView } from "@/components/listings/browse-view";
import { BROWSE_PAGE, filtersFrom } from "@/components/listings/browse-filters";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Find material" };

export default async function BrowsePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { cursor: _cursor, limit: _limit, amount, when, ...raw } = browseParams(await searchParams);
  const parsed = browseQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : {};
  const user = await currentUser();
  const [page, beds] = await Promise.all([browseListings({ ...query, limit: BROWSE_PAGE }), user?.roles.includes("gardener") ? bedsStillNeed(user.id) : Promise.resolve([])]);
  return (
    <div>
      <PageHeading
        title="Find material"
        lead="Board, leaves, straw, worms and the greens that go with them, from people near you with some to spare. Choose a lane, say how far you can go, and how much you are after."
      />
      {parsed.success ? null : (
        <div className="mb-4">
          <Notice tone="caution">Part of that link did not make sense to us, so it shows everything on offer instead.</Notice>
        </div>
      )}
      <BrowseView initial={{ filters: filtersFrom(query, { amount, when }), page }} system={await viewerUnits(user)} beds={beds} signedIn={user !== null} />
    </div>
  );
}
