import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { cacheStatements } from "@/db/sqlite-client";

// Prepared statements kept per connection (db/sqlite-client.ts): prepared once, still right
// after the schema changes under them, and never more than the cache holds.

describe("kept prepared statements", () => {
  it("prepare each query once, follow schema changes, and drop the least recently used", () => {
    const db = new Database(":memory:");
    let prepared = 0;
    const prepare = db.prepare.bind(db);
    db.prepare = ((sql: string) => {
      prepared++;
      return prepare(sql);
    }) as typeof db.prepare;
    cacheStatements(db, 2);
    db.prepare("CREATE TABLE t (a INTEGER)").run();
    db.prepare("INSERT INTO t (a) VALUES (?)").run(1);
    db.prepare("INSERT INTO t (a) VALUES (?)").run(2);
    expect(prepared).toBe(2);
    expect(db.prepare("SELECT * FROM t ORDER BY a").all()).toEqual([{ a: 1 }, { a: 2 }]);

    db.exec("ALTER TABLE t ADD COLUMN b TEXT DEFAULT 'x'");
    expect(db.prepare("SELECT * FROM t ORDER BY a").all()).toEqual([{ a: 1, b: "x" }, { a: 2, b: "x" }]);
    expect(prepared).toBe(3);

    // Two kept at most: the INSERT was used least recently and is prepared again.
    db.prepare("SELECT count(*) AS n FROM t").get();
    db.prepare("INSERT INTO t (a) VALUES (?)").run(3);
    expect(prepared).toBe(5);
    db.close();
  });
});
