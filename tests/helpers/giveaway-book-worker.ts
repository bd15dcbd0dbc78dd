// One process of the concurrency test: its own Knex connection to the shared SQLite file,
// firing its bookings at the agreed moment. Run with
//   node --conditions=react-server --import tsx tests/helpers/giveaway-book-worker.ts
// and DATABASE_FILE, NODE_ENV=test, DAY_ID, START_AT (epoch ms) and JOBS (JSON) set.
import { bookGiveaway } from "@/lib/services/giveaways/book-giveaway";
import { db } from "@/db/index";

const jobs = JSON.parse(process.env.JOBS ?? "[]") as { userId: string; slotId: string; quantity: number }[];
const dayId = process.env.DAY_ID!;
const startAt = Number(process.env.START_AT);

async function main() {
  await db().raw("select 1"); // connect before the start line, so every process is ready at once
  await new Promise((r) => setTimeout(r, Math.max(0, startAt - Date.now())));
  const results = await Promise.all(
    jobs.map((j) =>
      bookGiveaway(j.userId, dayId, { slot_id: j.slotId, quantity: j.quantity }).then(
        (b) => ({ ok: true, id: b.id }),
        (e: { code?: string; message?: string }) => ({ ok: false, code: e.code ?? "error", message: e.message }),
      ),
    ),
  );
  process.stdout.write(JSON.stringify(results));
  await db().destroy();
}

main().catch((err) => {
  process.stderr.write(String(err?.stack ?? err));
  process.exit(1);
});
