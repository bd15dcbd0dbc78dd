// The one place where SQLite and PostgreSQL differ. Everything else — repositories,
// services, migrations, tests — asks this module instead of looking at the Knex client:
//
// - which engine a connection or transaction talks to (`engineOf`, `isPg`);
// - how PostgreSQL's rows are turned into the types db/types.ts declares, the same as
//   SQLite's (`pgTypes`: DATE as YYYY-MM-DD text, timestamps as ISO text with milliseconds,
//   counts and numerics as numbers);
// - what an error means (`errorKind`): a unique or foreign-key violation, a busy database,
//   a serialisation failure or deadlock worth running the transaction again, a read-only
//   database, a lost connection;
// - row locks (`lockForUpdate`, `claimBatch`, `lockRows`): real locks on PostgreSQL, nothing
//   on SQLite, where a write transaction already holds the whole database;
// - byte-wise text order (`byteOrder`), so a sort never depends on the server's collation;
// - the per-engine pieces of full-text search (`matchWords`) and of the spatial index
//   (`EARTH_POINT_FUNCTION`, `nearBox`).
import type { Knex } from "knex";
import pg from "pg";

export type Engine = "sqlite" | "pg";

type HasClient = { client: { dialect?: unknown; config: { client?: unknown } } };

/**
 * The engine behind a Knex instance, transaction or query builder: by the client's dialect
 * name, which also holds when the client is a class (db/sqlite-client.ts), not a name.
 */
export function engineOf(q: HasClient): Engine {
  const name = q.client.dialect ?? q.client.config.client;
  return name === "postgresql" || name === "pg" || name === "postgres" ? "pg" : "sqlite";
}

export const isPg = (q: HasClient): boolean => engineOf(q) === "pg";

// ---------------------------------------------------------------------------------------
// Types: PostgreSQL rows shaped like SQLite's.

/** PostgreSQL type oids the app reads (pg_type.oid, stable across versions). */
const OID = { INT8: 20, NUMERIC: 1700, DATE: 1082, TIMESTAMP: 1114, TIMESTAMPTZ: 1184 } as const;

const toNumber = (s: string) => Number(s);
const keepText = (s: string) => s;
const asIso = (base: (s: string) => unknown) => (s: string) => {
  const v = base(s);
  // "infinity" comes back as a number from pg-types; leave anything but a real Date alone.
  return v instanceof Date && !Number.isNaN(v.getTime()) ? v.toISOString() : v;
};

const textParsers: Record<number, (s: string) => unknown> = {
  // count(*) and sum() of integers are bigint; every count the app makes fits a double.
  [OID.INT8]: toNumber,
  [OID.NUMERIC]: toNumber,
  // A calendar day has no time zone: keep the text, never a Date at local midnight.
  [OID.DATE]: keepText,
  [OID.TIMESTAMP]: asIso((s) => pg.types.getTypeParser(OID.TIMESTAMP, "text")(`${s}+00`)),
  [OID.TIMESTAMPTZ]: asIso(pg.types.getTypeParser(OID.TIMESTAMPTZ, "text")),
};

/**
 * The `types` option of a pg connection: this app's parsers for its own connections only,
 * pg's defaults for everything else (floats and integers are numbers already).
 */
export const pgTypes = {
  getTypeParser(oid: number, format: "text" | "binary" = "text") {
    return (format === "text" && textParsers[oid]) || pg.types.getTypeParser(oid, format);
  },
};

// ---------------------------------------------------------------------------------------
// Errors.

export type ErrorKind =
  | "unique" // a unique or primary key already taken
  | "foreign_key" // a row that points nowhere, or is still pointed at
  | "check" // a CHECK constraint (or SQLite's RAISE(ABORT) trigger standing in for one)
  | "not_null"
  | "busy" // SQLite: another connection holds the write lock past the busy timeout
  | "serialization" // PostgreSQL: could not serialise access (40001)
  | "deadlock" // PostgreSQL: deadlock detected (40P01)
  | "lock_timeout" // PostgreSQL: NOWAIT or lock_timeout (55P03)
  | "read_only" // a read-only file, a read-only transaction or a hot standby
  | "connection"; // the connection is gone: server shut down, network cut, file closed

const PG_CODES: Record<string, ErrorKind> = {
  "23505": "unique",
  "23503": "foreign_key",
  "23514": "check",
  "23502": "not_null",
  "40001": "serialization",
  "40P01": "deadlock",
  "55P03": "lock_timeout",
  "25006": "read_only",
  "57P01": "connection", // admin_shutdown
  "57P02": "connection", // crash_shutdown
  "57P03": "connection", // cannot_connect_now
};

const NODE_CONNECTION_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "ENOTFOUND", "EHOSTUNREACH"]);

function sqliteKind(code: string, message: string): ErrorKind | null {
  if (code === "SQLITE_CONSTRAINT_UNIQUE" || code === "SQLITE_CONSTRAINT_PRIMARYKEY" || /UNIQUE constraint failed/.test(message)) return "unique";
  if (code === "SQLITE_CONSTRAINT_FOREIGNKEY" || /FOREIGN KEY constraint failed/.test(message)) return "foreign_key";
  if (code === "SQLITE_CONSTRAINT_CHECK" || code === "SQLITE_CONSTRAINT_TRIGGER") return "check";
  if (code === "SQLITE_CONSTRAINT_NOTNULL") return "not_null";
  if (code.startsWith("SQLITE_BUSY") || code.startsWith("SQLITE_LOCKED") || /database is locked/.test(message)) return "busy";
  if (code.startsWith("SQLITE_READONLY") || /attempt to write a readonly database/.test(message)) return "read_only";
  if (/database connection is not open/.test(message) || code.startsWith("SQLITE_IOERR") || code.startsWith("SQLITE_CANTOPEN")) return "connection";
  return null;
}

/** What a database error means, on either engine; null for anything else. */
export function errorKind(err: unknown): ErrorKind | null {
  const e = err as { code?: unknown; message?: unknown } | null | undefined;
  const code = typeof e?.code === "string" ? e.code : "";
  const message = typeof e?.message === "string" ? e.message : "";
  if (PG_CODES[code]) return PG_CODES[code];
  if (code.startsWith("08")) return "connection"; // connection_exception class
  if (NODE_CONNECTION_CODES.has(code) || /Connection terminated|Client has encountered a connection error/.test(message)) return "connection";
  return sqliteKind(code, message);
}

export const isUniqueViolation = (err: unknown) => errorKind(err) === "unique";
export const isForeignKeyViolation = (err: unknown) => errorKind(err) === "foreign_key";

/**
 * Worth running the whole transaction again: SQLite was busy, or PostgreSQL gave up on
 * this transaction to keep others consistent (a serialisation failure or a deadlock).
 */
export function isRetryable(err: unknown): boolean {
  const kind = errorKind(err);
  return kind === "busy" || kind === "serialization" || kind === "deadlock";
}

// ---------------------------------------------------------------------------------------
// Row locks.
//
// SQLite has one writer at a time: a transaction that has written holds the whole database
// until it commits, and one that writes first (the conditional UPDATE) holds it before it
// reads. PostgreSQL lets transactions run side by side under READ COMMITTED, so one that
// reads a row and decides on it must lock the row first.

/** `SELECT … FOR UPDATE` on PostgreSQL (when `when` holds); the query unchanged on SQLite. */
export function lockForUpdate<T extends Knex.QueryBuilder>(qb: T, when = true): T {
  return (when && isPg(qb as unknown as HasClient) ? qb.forUpdate() : qb) as T;
}

/**
 * A worker's batch: `FOR UPDATE SKIP LOCKED` on PostgreSQL, so two workers reading at once
 * take different rows instead of queueing on the same ones; unchanged on SQLite.
 */
export function claimBatch<T extends Knex.QueryBuilder>(qb: T): T {
  return (isPg(qb as unknown as HasClient) ? qb.forUpdate().skipLocked() : qb) as T;
}

/**
 * Locks the rows of `table` matching `where` without reading them into the app: FOR UPDATE
 * (to change them) or FOR SHARE (to keep them as they are until commit, letting other
 * sharers in). On SQLite it runs nothing at all, so a transaction that starts with it still
 * takes SQLite's write lock with its first real write.
 */
export async function lockRows(q: Knex | Knex.Transaction, table: string, where: Record<string, unknown>, mode: "update" | "share" = "update"): Promise<void> {
  if (!isPg(q)) return;
  const qb = q(table).select(q.raw("1")).where(where);
  await (mode === "share" ? qb.forShare() : qb.forUpdate());
}

// ---------------------------------------------------------------------------------------
// Text order.

/**
 * A column to sort or compare as bytes. SQLite's default (BINARY) already does; on
 * PostgreSQL the database's collation (en_US, ICU …) would put "alice" before "Bob" and may
 * ignore punctuation, so this names the "C" collation.
 */
export function byteOrder(q: Knex | Knex.Transaction, column: string): Knex.Raw {
  return isPg(q) ? q.raw('?? COLLATE "C"', [column]) : q.raw("??", [column]);
}

// ---------------------------------------------------------------------------------------
// Full-text search.

export interface TextIndex {
  /** SQLite: the FTS5 table, the column in it naming the row, and the row's key outside. */
  fts: { table: string; key: string; rowKey: string };
  /** PostgreSQL: the tsvector expression a GIN index is built on, spelled exactly the same. */
  document: string;
  /** The text search configuration of `document`. */
  config: string;
}

/**
 * Rows whose text holds every word as a prefix. `words` must already be reduced to
 * letters and digits; each is quoted on SQLite so FTS5 syntax in a search does nothing.
 */
export function matchWords(qb: Knex.QueryBuilder, index: TextIndex, words: string[]): Knex.QueryBuilder {
  if (isPg(qb as unknown as HasClient)) {
    return qb.whereRaw(`${index.document} @@ to_tsquery('${index.config}', ?)`, [words.map((w) => `${w}:*`).join(" & ")]);
  }
  const { table, key, rowKey } = index.fts;
  return qb.whereRaw(`${rowKey} IN (SELECT ${key} FROM ${table} WHERE ${table} MATCH ?)`, [words.map((w) => `"${w}"*`).join(" ")]);
}

// ---------------------------------------------------------------------------------------
// Spatial index (PostgreSQL).
//
// A point on the globe becomes a point in 3-D space (the contrib `cube` type, trusted, so
// no superuser is needed); a GiST index on that expression finds everything inside a cube
// around a place without reading the table. The cube is only a prefilter: callers keep
// their own exact distance (or latitude/longitude box) test, so results are those of
// SQLite's path, where the B-tree on (status, material_code, approx_lat, approx_lng) does
// the prefiltering.

/**
 * The immutable SQL function the index is built on (migrations/20261207_015_spatial_index):
 * a latitude and longitude as a point on the sphere Turf measures on (radius 6,371,008.8 m).
 */
export const EARTH_POINT_FUNCTION = "duffbank_earth_point";

/**
 * On PostgreSQL, keeps rows whose (latColumn, lngColumn) lies within `radiusM` metres (great
 * circle, on Turf's sphere) of `center`, through the GiST index; on SQLite the query is
 * unchanged. The straight-line distance between two points on a sphere is never more than
 * the distance along it, so the cube holds every such row.
 */
export function nearBox(qb: Knex.QueryBuilder, center: { lat: number; lng: number }, radiusM: number, latColumn = "approx_lat", lngColumn = "approx_lng") {
  if (!isPg(qb as unknown as HasClient)) return qb;
  // 0.1 % spare for rounding; the caller's exact test removes what the cube lets through.
  const reach = radiusM * 1.001 + 1;
  return qb.whereRaw(`cube_enlarge(${EARTH_POINT_FUNCTION}(?, ?), ?, 3) @> ${EARTH_POINT_FUNCTION}(??, ??)`, [
    center.lat,
    center.lng,
    reach,
    latColumn,
    lngColumn,
  ]);
}
