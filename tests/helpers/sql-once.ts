// One statement on a PostgreSQL database, for a caller that must wait for it synchronously
// (tests/helpers/engine.ts otherConnection): reads {url, sql, params} as JSON on stdin, with
// `?` placeholders as Knex writes them, runs it through the app's own connection settings
// (so rows have the app's types) and prints the rows as JSON.
import fs from "node:fs";
import knex from "knex";
import { pgConfig } from "@/knexfile";

async function main() {
  const { url, sql, params } = JSON.parse(fs.readFileSync(0, "utf8")) as { url: string; sql: string; params: unknown[] };
  const conn = knex({ ...pgConfig(url), pool: { min: 0, max: 1 } });
  try {
    const result = await conn.raw(sql, params as never);
    process.stdout.write(JSON.stringify(result.rows ?? []));
  } finally {
    await conn.destroy();
  }
}

main().catch((err) => {
  process.stderr.write(`${(err as Error).message}\n`);
  process.exit(1);
});
