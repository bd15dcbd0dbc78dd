// `node --import tsx tests/helpers/pg-database-cli.ts create|drop <name>` on DATABASE_URL's
// server: for shell scripts (the end-to-end run on PostgreSQL) that need a database of their
// own. `create` prints the new database's URL.
import { adminConnection, createDatabase, databaseUrl, dropDatabase } from "./pg-databases";

async function main() {
  const [command, name] = process.argv.slice(2);
  const admin = adminConnection();
  try {
    if (command === "create") {
      await dropDatabase(admin, name);
      await createDatabase(admin, name);
      process.stdout.write(databaseUrl(name));
    } else if (command === "drop") {
      await dropDatabase(admin, name);
    } else {
      throw new Error("usage: pg-database-cli.ts create|drop <name>");
    }
  } finally {
    await admin.destroy();
  }
}

main().catch((err) => {
  process.stderr.write(`${(err as Error).message}\n`);
  process.exit(1);
});
