// Vitest's global setup. On PostgreSQL (DATABASE_URL set) it migrates one template database
// for the run; every test file then gets a fresh copy of it (tests/helpers/db.ts), and all of
// the run's databases are dropped at the end. On SQLite there is nothing to do: each test file
// makes and migrates its own file.
import knex from "knex";
import { pgConfig } from "@/knexfile";
import { adminConnection, createDatabase, databasesLike, databaseUrl, dropDatabase, uniqueName } from "./helpers/pg-databases";

export async function setup() {
  if (!process.env.DATABASE_URL) return;
  const admin = adminConnection();
  const runPrefix = uniqueName("duffbank_test_") + "_";
  const template = `${runPrefix}template`;
  try {
    await createDatabase(admin, template);
    const tpl = knex(pgConfig(databaseUrl(template)));
    try {
      await tpl.migrate.latest();
    } finally {
      await tpl.destroy();
    }
  } finally {
    await admin.destroy();
  }
  // Test files read these (worker processes inherit the environment).
  process.env.DUFFBANK_TEST_DB_PREFIX = runPrefix;
  process.env.DUFFBANK_TEST_DB_TEMPLATE = template;

  return async () => {
    const cleanup = adminConnection();
    try {
      for (const name of await databasesLike(cleanup, runPrefix)) await dropDatabase(cleanup, name);
    } finally {
      await cleanup.destroy();
    }
  };
}
