// One worker process of the outbox concurrency test: its own Knex connection to the shared
// SQLite file and its own SMTP connection, running the deliver-outbox job from the agreed
// moment until it finds nothing more to send. Run with
//   node --conditions=react-server --import tsx tests/helpers/outbox-deliver-worker.ts
// and DATABASE_FILE, NODE_ENV=test, SMTP_PORT and START_AT (epoch ms) set.
import { deliverOutbox } from "@/lib/mail/deliver-outbox";
import { db } from "@/db/index";

const startAt = Number(process.env.START_AT);

async function main() {
  await db().raw("select 1"); // connect before the start line, so both processes are ready at once
  await new Promise((r) => setTimeout(r, Math.max(0, startAt - Date.now())));
  let sent = 0;
  let failed = 0;
  let rounds = 0;
  for (;;) {
    const r = await deliverOutbox();
    rounds++;
    sent += r.sent;
    failed += r.failed;
    if (r.sent === 0 && r.failed === 0) break;
  }
  process.stdout.write(JSON.stringify({ sent, failed, rounds }));
  await db().destroy();
}

main().catch((err) => {
  process.stderr.write(String(err?.stack ?? err));
  process.exit(1);
});
