// `npm run db:migrate | db:rollback | db:seed` — the same migration list the app uses.
// `npm run db:backup -- <file>` and `npm run db:restore -- <file> [--force]` (db/backup.ts).
// A script, not part of db/: it reaches for the demo seed and the environment checks, which the
// data layer itself never imports.
import "../lib/env-files";
import knex from "knex";
import { checkStartup, dbEnvironment } from "../lib/env";
import { configFor } from "../knexfile";
import { seed } from "../seeds/demo";
import { backupDatabase, restoreDatabase, type BackupResult } from "../db/backup";

function describe(r: BackupResult): string {
  const rows = Object.entries(r.tables).map(([t, n]) => `${t} ${n}`).join(", ");
  return `${r.file} (${(r.bytes / 1024).toFixed(0)} KiB): ${rows}`;
}

async function main() {
  const command = process.argv[2];
  const env = dbEnvironment();
  // Copying the database in or out uses no secret: a backup job needs only the database's address.
  if (command === "backup" || command === "restore") {
    const file = process.argv.slice(3).find((a) => !a.startsWith("--"));
    if (!file) throw new Error(`name the file: npm run db:${command} -- <file>${command === "restore" ? " [--force]" : ""}`);
    if (command === "backup") {
      console.log(`[db] backed up to ${describe(await backupDatabase(configFor(env), file))}`);
    } else {
      const r = await restoreDatabase(configFor(env), file, { force: process.argv.includes("--force") });
      console.log(`[db] restored ${describe(r)}${r.keptAs ? `; the database it replaced is kept as ${r.keptAs}` : ""}`);
      console.log("[db] start the app as usual: it runs any newer migrations first.");
    }
    return;
  }
  checkStartup("db");
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
      throw new Error(`unknown command ${command ?? "(none)"}; use migrate, rollback, seed, backup or restore`);
    }
  } finally {
    await conn.destroy();
  }
}

main().catch((err) => {
  console.error("[db]", err.message);
  process.exit(1);
});
