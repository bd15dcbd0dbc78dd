import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import knex, { type Knex } from "knex";
import { pgConfig, sqliteConfig } from "@/knexfile";
import { setDb } from "@/db/index";
import { adminConnection, createDatabase, databaseUrl, dropDatabase, uniqueName } from "./pg-databases";

export interface TestDb {
  db: Knex;
  /** The SQLite file; on PostgreSQL the fresh database's name. */
  file: string;
  /** What a child process needs in its environment to open this same database. */
  env: { DATABASE_FILE: string } | { DATABASE_URL: string };
  /** Another Knex instance (connections of its own) on this same database; destroy it when done. */
  connect: () => Knex;
  close: () => Promise<void>;
}

/** A fresh migrated database of the test file's own, wired in as the app's database. */
export async function freshDb(opts: { seed?: boolean; materials?: boolean } = {}): Promise<TestDb> {
  const made = process.env.DATABASE_URL ? await freshPg() : await freshSqlite();
  if (opts.seed) {
    const { seed } = await import("@/seeds/demo");
    await seed(made.db);
  } else if (opts.materials) {
    const { seedMaterials } = await import("@/seeds/demo");
    await seedMaterials(made.db);
  }
  setDb(made.db);
  return {
    ...made,
    close: async () => {
      setDb(undefined);
      await made.db.destroy();
      await made.remove();
    },
  };
}

async function freshSqlite() {
  const file = path.join(os.tmpdir(), `duffbank-it-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.sqlite`);
  const instance = knex(sqliteConfig(file));
  await instance.migrate.latest();
  return {
    db: instance,
    file,
    env: { DATABASE_FILE: file },
    connect: () => knex(sqliteConfig(file)),
    remove: async () => {
      for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
    },
  };
}

// A copy of the run's migrated template (tests/global-setup.ts); without one (a single file
// run outside Vitest's setup) a new database migrated here.
async function freshPg() {
  const template = process.env.DUFFBANK_TEST_DB_TEMPLATE;
  const name = uniqueName(process.env.DUFFBANK_TEST_DB_PREFIX ?? "duffbank_test_");
  const admin = adminConnection();
  try {
    await createDatabase(admin, name, template);
  } finally {
    await admin.destroy();
  }
  const url = databaseUrl(name);
  const instance = knex(pgConfig(url));
  if (!template) await instance.migrate.latest();
  return {
    db: instance,
    file: name,
    env: { DATABASE_URL: url },
    connect: () => knex(pgConfig(url)),
    remove: async () => {
      const a = adminConnection();
      try {
        await dropDatabase(a, name);
      } finally {
        await a.destroy();
      }
    },
  };
}
