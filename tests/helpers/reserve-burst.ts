// A separate process that fires a burst of reservations at one SQLite file: the
// concurrency test starts several of these so the holds race on separate connections in
// separate processes, as an app server and its worker (or several servers) would.
// Usage: node --conditions=react-server --import tsx tests/helpers/reserve-burst.ts <listingId> <count> <startAtMs> <quantities,...> <gardenerIds,...>
import { reserveListings } from "@/lib/services/reservations/reserve-listing";
import { ApiError } from "@/lib/api/errors";
import { db } from "@/db/index";

async function main() {
  const [listingId, count, startAt, sizes, gardeners] = process.argv.slice(2);
  const quantities = sizes.split(",").map(Number);
  const people = gardeners.split(",");
  await db().raw("select 1"); // open the connection before the start line
  await new Promise((r) => setTimeout(r, Math.max(0, Number(startAt) - Date.now())));
  const outcomes = await Promise.all(
    Array.from({ length: Number(count) }, (_, i) =>
      reserveListings({ gardenerId: people[i % people.length], items: [{ listing_id: listingId, quantity: quantities[i % quantities.length] }], fieldPrefix: () => "" }).then(
        () => "held",
        (err) => (err instanceof ApiError ? err.code : `unexpected: ${(err as Error).message}`),
      ),
    ),
  );
  process.stdout.write(JSON.stringify(outcomes));
  await db().destroy();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
