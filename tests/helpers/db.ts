import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import knex, { type Knex } from "knex";
import { configFor } from "@/knexfile";
import { setDb } from "@/db/index";

/** A freshly migrated SQLite file of its own, wired in as the app's database. */
export async function freshDb(opts: { seed?: boolean; materials?: boolean } = {}): Promise<{ db: Knex; file: string; close: () => Promise<void> }> {
  const file = path.join(os.tmpdir(), `duffbank-it-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.sqlite`);
  const base = configFor("test");
  const instance = knex({ ...base, connection: { filename: file } });
  await instance.migrate.latest();
  if (opts.seed) {
    const { seed } = await import("@/seeds/demo");
    await seed(instance);
  } else if (opts.materials) {
    const { seedMaterials } = await import("@/seeds/demo");
    await seedMaterials(instance);
  }
  setDb(instance);
  return {
    db: instance,
    file,
    close: async () => {
      setDb(undefined);
      await instance.destroy();
      for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
    },
  };
}
