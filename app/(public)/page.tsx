import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { platformDivertedKg, platformGiveawayKg } from "@/lib/services/diversion-report";
import { countVisibleListings } from "@/db/listing-status";
import { formatKg } from "@/components/reports/format";
import { currentUser } from "@/lib/auth/current-user";
import { viewerUnits } from "@/lib/units/viewer";

// The figures below are live, so the page is rendered per request.
export const dynamic = "force-dynamic";

const STEPS = [
  { title: "Plan the bed", body: "Give its size or draw it on the map. Duffbank works out the cardboard, leaves, straw, water and worms it takes, and the year ahead." },
  { title: "Find it nearby", body: "Neighbours, shops, farms, worm growers and the council list what they have spare. We match your bed to the nearest supplies." },
  { title: "Reserve and collect", body: "Hold what you need, leave a small refundable deposit where asked, pick it up, and say how it went." },
  { title: "Let it turn to soil", body: "Reminders for the first soaks, the day to add worms, and the checks at six months and a year." },
];

export default async function Home() {
  const [keptKg, giveawayKg, onOffer, viewer] = await Promise.all([platformDivertedKg(), platformGiveawayKg(), countVisibleListings(), currentUser()]);
  const system = await viewerUnits(viewer);
  return (
    <div className="flex flex-col gap-12">
      <section className="grid items-center gap-8 md:grid-cols-[1.2fr_1fr]">
        <div className="flex flex-col gap-5">
          <h1 className="text-4xl font-bold leading-tight tracking-tight md:text-5xl">
            Build a no-dig bed from what your neighbours would throw away
          </h1>
          <p className="max-w-prose text-lg text-humus-700">
            Duffbank passes autumn leaves, straw bales, flat cardboard, coffee grounds and composting worms from the people who have too much to the
            people building new beds — and tells you exactly how much your bed needs.
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
        <figure className="rounded-leaf bg-white p-6 shadow-sm ring-1 ring-humus-200">
          <svg viewBox="0 0 320 160" role="img" aria-labelledby="layers-title" className="w-full">
            <title id="layers-title">A bed in layers: straw on top, then leaves, then cardboard, on the old soil</title>
            <rect x="0" y="130" width="320" height="30" fill="#523c27" />
            <rect x="20" y="116" width="280" height="14" fill="#a27f58" />
            <rect x="20" y="70" width="280" height="46" fill="#d9962b" />
            <rect x="20" y="52" width="280" height="18" fill="#f0c36b" />
            <g fill="#f7f3ee" fontSize="12" fontFamily="Work Sans, sans-serif">
              <text x="30" y="65">straw</text>
              <text x="30" y="98">leaves</text>
              <text x="30" y="127">cardboard</text>
              <text x="30" y="150">old soil</text>
            </g>
          </svg>
          <figcaption className="mt-2 text-sm text-humus-600">Layers go straight on the ground: no digging, no turning.</figcaption>
        </figure>
      </section>
      <section aria-labelledby="kept-title" className="flex flex-wrap items-center justify-between gap-4 rounded-leaf bg-moss-700 p-6 text-moss-50">
        <div>
          <h2 id="kept-title" className="text-sm font-semibold uppercase tracking-wide text-moss-100">
            Kept from the bin so far
          </h2>
          <p className="text-4xl font-bold" data-testid="kept-kg">
            {formatKg(keptKg, system)}
          </p>
          <p className="mt-1 max-w-prose text-sm text-moss-100">
            Leaves, straw, cardboard, grounds and chips collected from Duffbank listings (collected reservations only), weighed with published bulk densities.
          </p>
          {giveawayKg > 0 ? (
            <p className="mt-1 max-w-prose text-sm text-moss-100">
              Council giveaway days, counted apart: <strong data-testid="giveaway-kg">{formatKg(giveawayKg, system)}</strong> taken home by households checked in.
            </p>
          ) : null}
        </div>
        <p className="text-lg">
          <strong data-testid="on-offer">{onOffer}</strong> listings on offer now ·{" "}
          <Link href="/giveaways" className="font-semibold text-white underline underline-offset-4">
            Giveaway days
          </Link>
        </p>
      </section>
      <section aria-labelledby="how-title">
        <h2 id="how-title" className="mb-4 text-2xl font-bold">
          How it works
        </h2>
        <ol className="grid gap-4 md:grid-cols-4">
          {STEPS.map((s, i) => (
            <li key={s.title} className="rounded-lg bg-white p-5 ring-1 ring-humus-200">
              <p className="font-mono text-sm text-moss-600">{String(i + 1).padStart(2, "0")}</p>
              <h3 className="mt-1 font-semibold">{s.title}</h3>
              <p className="mt-2 text-sm text-humus-700">{s.body}</p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
