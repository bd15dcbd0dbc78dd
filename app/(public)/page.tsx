import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { formatKg } from "@/components/reports/format";
import { currentUser } from "@/lib/auth/current-user";
import { viewerUnits } from "@/lib/units/viewer";
import { BedStory } from "@/components/home/bed-story";
import { LayerPicture } from "@/components/home/layer-picture";
import { communityFigures } from "@/lib/services/figures/count-community-figures";

// The figures below are live, so the page is rendered per request.
export const dynamic = "force-dynamic";

export default async function Home() {
  const [{ keptKg, giveawayKg, onOffer, beds, bedAreaM2 }, viewer] = await Promise.all([communityFigures(), currentUser()]);
  const system = await viewerUnits(viewer);
  return (
    <div className="flex flex-col gap-12">
      <section className="grid items-center gap-8 md:grid-cols-[1.15fr_1fr]">
        <div className="flex flex-col gap-5">
          <h1 className="text-4xl font-bold leading-tight tracking-tight md:text-5xl">Build a no-dig bed from what your neighbours would throw away</h1>
          <p className="max-w-prose text-lg text-humus-700">
            Cardboard, autumn leaves and a little straw, laid straight on the grass, turn into soil in a year. Duffbank works out exactly how much your bed
            takes and finds it near you, from people who have too much of it.
          </p>
          <div className="flex flex-wrap gap-3">
            <Link href="/plan" className={buttonClass("primary")}>
              Plan a bed
            </Link>
            <Link href="/browse" className={buttonClass("secondary")}>
              Find material nearby
            </Link>
            <Link href="/sign-up" className={buttonClass("secondary")}>
              I have material to give
            </Link>
          </div>
        </div>
        <LayerPicture system={system} />
      </section>

      <BedStory beds={beds} bedAreaM2={bedAreaM2} system={system} />

      <section aria-labelledby="passed-title" className="grid gap-6 rounded-leaf bg-white p-6 ring-1 ring-humus-200 md:grid-cols-[1fr_1fr]">
        <div className="flex flex-col gap-2">
          <h2 id="passed-title" className="text-2xl font-bold">
            Where the layers come from
          </h2>
          <p className="text-humus-700">
            Every bed above is built from someone else&apos;s spare: a neighbour&apos;s raked leaves, a shop&apos;s boxes, a farm&apos;s spoiled bales, a
            council&apos;s leaf collection. Passed on through Duffbank so far:
          </p>
          <p className="text-4xl font-bold text-moss-800" data-testid="kept-kg">
            {formatKg(keptKg, system)}
          </p>
          <p className="text-sm text-humus-700">collected from neighbours&apos; listings, weighed with published bulk densities (collected reservations only).</p>
          {giveawayKg > 0 ? (
            <p className="text-sm text-humus-700">
              And <strong data-testid="giveaway-kg">{formatKg(giveawayKg, system)}</strong> taken home from council giveaway days by households checked in, counted apart.
            </p>
          ) : null}
        </div>
        <div className="flex flex-col justify-center gap-3 rounded-leaf bg-moss-50 p-5 ring-1 ring-moss-200">
          <p className="text-lg">
            <strong data-testid="on-offer">{onOffer}</strong> listings are waiting to be collected right now.
          </p>
          <div className="flex flex-wrap gap-3">
            <Link href="/browse" className={buttonClass("primary")}>
              See what is near you
            </Link>
            <Link href="/giveaways" className={buttonClass("secondary")}>
              Giveaway days
            </Link>
          </div>
        </div>
      </section>
    </div>
  );
}
