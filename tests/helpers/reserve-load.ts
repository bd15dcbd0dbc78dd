// Write load for the backup test: one process reserving one unit at a time, as fast as it
// can, through the app's own service, until the file `stopFile` appears (or two minutes pass). Each reservation is one transaction
// that writes the reservation, its history row, the listing's held quantity and two e-mails,
// so a copy taken mid-way shows at once whether it holds whole transactions only.
// Usage: node --conditions=react-server --import tsx tests/helpers/reserve-load.ts <listingId> <gardenerId> <stopFile>
import fs from "node:fs";
import { reserveListings } from "@/lib/services/reservations/reserve-listing";
import { db } from "@/db/index";

async function main() {
  const [listingId, gardenerId, stopFile] = process.argv.slice(2);
  const cap = Date.now() + 120_000; // a test that dies without stopping its writers
  let held = 0;
  while (!fs.existsSync(stopFile) && Date.now() < cap) {
    await reserveListings({ gardenerId, items: [{ listing_id: listingId, quantity: 1 }], fieldPrefix: () => "" });
    held++;
  }
  process.stdout.write(JSON.stringify({ held }));
  await db().destroy();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
