// One worker process of a test that runs workers side by side: its own database connection,
// running the named worker jobs once each, in order, from the agreed moment on the given
// clock. Run with
//   node --conditions=react-server --import tsx tests/helpers/worker-jobs-at.ts <job> [job …]
// and the database (DATABASE_FILE or DATABASE_URL), NODE_ENV=test, START_AT (epoch ms) and
// CLOCK (ISO time) set, plus whatever the jobs talk to (STRIPE_FAKE_PORT, SMTP_PORT).
import { jobs } from "@/lib/worker/jobs";
import { db } from "@/db/index";

async function main() {
  const names = process.argv.slice(2);
  const clock = () => new Date(process.env.CLOCK!);
  await db().raw("select 1"); // connect before the start line, so every process is ready at once
  await new Promise((r) => setTimeout(r, Math.max(0, Number(process.env.START_AT) - Date.now())));
  const results: Record<string, unknown> = {};
  for (const name of names) results[name] = await jobs.find((j) => j.name === name)!.run({ clock });
  process.stdout.write(JSON.stringify(results));
  await db().destroy();
}

main().catch((err) => {
  process.stderr.write(String(err?.stack ?? err));
  process.exit(1);
});
