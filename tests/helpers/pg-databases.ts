// Databases on a PostgreSQL server for tests and the bench: the server is DATABASE_URL's,
// each database a name of its own on it. Creating one from a migrated template is a file
// copy on the server, far quicker than migrating every time.
import knex, { type Knex } from "knex";
import { pgConfig } from "@/knexfile";

/** DATABASE_URL with another database name. */
export function databaseUrl(name: string, base = process.env.DATABASE_URL): string {
  if (!base) throw new Error("DATABASE_URL is not set");
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}

/** A connection to DATABASE_URL's own database (left untouched), for CREATE and DROP DATABASE. */
export function adminConnection(base = process.env.DATABASE_URL): Knex {
  if (!base) throw new Error("DATABASE_URL is not set");
  return knex({ ...pgConfig(base), pool: { min: 0, max: 1 } });
}

const ident = (name: string) => {
  if (!/^[a-z0-9_]+$/.test(name)) throw new Error(`not a plain database name: ${name}`);
  return `"${name}"`;
};

export async function createDatabase(admin: Knex, name: string, template?: string): Promise<void> {
  // The template's own connections must be closed; a copy of a quiet template takes a few ms.
  await admin.raw(`CREATE DATABASE ${ident(name)}${template ? ` TEMPLATE ${ident(template)}` : ""}`);
}

export async function dropDatabase(admin: Knex, name: string): Promise<void> {
  await admin.raw(`DROP DATABASE IF EXISTS ${ident(name)} WITH (FORCE)`);
}

/** Names of this run's databases: every one starts with the prefix. */
export async function databasesLike(admin: Knex, prefix: string): Promise<string[]> {
  const rows: { datname: string }[] = await admin("pg_database").select("datname").where("datname", "like", `${prefix}%`);
  return rows.map((r) => r.datname);
}

/** A unique, lower-case database name under `prefix`. */
export function uniqueName(prefix: string): string {
  return `${prefix}${process.pid}_${Date.now().toString(36)}_${Math.random().toString(36).slice(2, 8)}`;
}
