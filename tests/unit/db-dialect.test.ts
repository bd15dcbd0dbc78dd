// The dialect module's pure parts: what PostgreSQL's text values become, and what an error
// from either engine is taken to mean. (Locks, byte order, search and the spatial index are
// exercised against real databases in tests/integration/engine.test.ts and match-candidates.)
import { describe, expect, it } from "vitest";
import { engineOf, errorKind, isRetryable, pgTypes } from "@/db/dialect";

const parse = (oid: number, text: string) => (pgTypes.getTypeParser(oid) as (s: string) => unknown)(text);

describe("PostgreSQL values as db/types.ts declares them", () => {
  it.each([
    ["timestamptz with microseconds and an offset", 1184, "2026-03-01 10:15:30.123456+01", "2026-03-01T09:15:30.123Z"],
    ["timestamptz in UTC, whole seconds", 1184, "2026-12-31 23:59:59+00", "2026-12-31T23:59:59.000Z"],
    ["timestamp without zone, read as UTC", 1114, "2026-03-01 09:15:30.5", "2026-03-01T09:15:30.500Z"],
    ["date: the calendar day as written", 1082, "2026-03-01", "2026-03-01"],
    ["bigint count", 20, "12345", 12345],
    ["numeric average", 1700, "4.5000000000000000", 4.5],
  ])("%s", (_name, oid, text, want) => {
    expect(parse(oid, text)).toEqual(want);
  });

  it("leaves infinity alone and other types to pg's own parsers", () => {
    expect(parse(1184, "infinity")).toBe(Infinity);
    expect(parse(701, "0.1")).toBe(0.1); // double precision: already a number
    expect(parse(16, "t")).toBe(true);
  });
});

describe("errors on either engine", () => {
  it.each([
    [{ code: "23505" }, "unique"],
    [{ code: "SQLITE_CONSTRAINT_PRIMARYKEY" }, "unique"],
    [{ code: "SQLITE_CONSTRAINT_UNIQUE" }, "unique"],
    [{ code: "23503" }, "foreign_key"],
    [{ code: "SQLITE_CONSTRAINT_FOREIGNKEY" }, "foreign_key"],
    [{ code: "23514" }, "check"],
    [{ code: "SQLITE_CONSTRAINT_TRIGGER" }, "check"],
    [{ code: "SQLITE_BUSY" }, "busy"],
    [{ code: "SQLITE_BUSY_SNAPSHOT" }, "busy"],
    [{ code: "40001" }, "serialization"],
    [{ code: "40P01" }, "deadlock"],
    [{ code: "55P03" }, "lock_timeout"],
    [{ code: "25006" }, "read_only"],
    [{ code: "SQLITE_READONLY" }, "read_only"],
    [{ code: "57P01" }, "connection"],
    [{ code: "08006" }, "connection"],
    [{ code: "ECONNREFUSED" }, "connection"],
    [{ code: "SQLITE_CANTOPEN" }, "connection"],
    [new TypeError("The database connection is not open"), "connection"],
    [new Error("Connection terminated unexpectedly"), "connection"],
    [new Error("something else"), null],
    [null, null],
  ])("%j is %s", (err, kind) => {
    expect(errorKind(err)).toBe(kind);
  });

  it("runs again on busy, serialisation failures and deadlocks only", () => {
    expect([{ code: "SQLITE_BUSY" }, { code: "40001" }, { code: "40P01" }].every(isRetryable)).toBe(true);
    expect([{ code: "23505" }, { code: "25006" }, new Error("x")].some(isRetryable)).toBe(false);
  });
});

describe("the engine", () => {
  it("is told by the client's dialect, or its name", () => {
    expect(engineOf({ client: { dialect: "postgresql", config: {} } })).toBe("pg");
    expect(engineOf({ client: { config: { client: "pg" } } })).toBe("pg");
    expect(engineOf({ client: { dialect: "better-sqlite3", config: { client: class {} } } })).toBe("sqlite");
  });
});
