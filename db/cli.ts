// `npm run db:migrate | db:rollback | db:seed` — the same migration list the app uses.
import knex from "knex";
import { checkStartup } from "../lib/env";
import { configFor } from "../knexfile";
import { seed } from "../seeds/demo";

async function main() {
  const command = process.argv[2];
  checkStartup("db");
  const env = process.env.DUFFBANK_DB_ENV ?? (process.env.NODE_ENV === "production" ? "production" : "development");
  const conn = knex(configFor(env));
  try {
    if (command === "migrate") {
      const [batch, names] = await conn.migrate.latest();
      console.log(names.length ? `[db] batch ${batch}: ${names.join(", ")}` : "[db] already up to date");
    } else if (command === "rollback") {
      const [batch, names] = await conn.migrate.rollback(undefined, process.argv.includes("--all"));
      console.log(names.length ? `[db] rolled back batch ${batch}: ${names.join(", ")}` : "[db] nothing to roll back");
    } else if (command === "seed") {
      const counts = await seed(conn);
      console.log(`[db] demo seeded: ${JSON.stringify(counts)}`);
    } else {
      throw new Error(`unknown command ${command ?? "(none)"}; use migrate, rollback or seed`);
    }
  } finally {
    await conn.destroy();
  }
}

main().catch((err) => {
  console.error("[db]", err.message);
  process.exit(1);
});
