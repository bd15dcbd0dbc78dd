// knex ships its dialect clients without type declarations; db/sqlite-client.ts extends one.
declare module "knex/lib/dialects/better-sqlite3" {
  import type { Knex } from "knex";
  class Client_BetterSQLite3 extends Knex.Client {
    _query(connection: unknown, obj: unknown): Promise<unknown>;
  }
  export = Client_BetterSQLite3;
}
