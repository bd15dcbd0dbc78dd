import { db, type Db } from "./index";

// One row per live process that says it is alive: each worker every few seconds, and each app
// process whenever readiness is asked (which is also readiness's proof that a write works).

export type HeartbeatKind = "worker" | "app";

export interface HeartbeatRow {
  id: string;
  kind: HeartbeatKind;
  host: string;
  pid: number;
  started_at: string;
  beat_at: string;
}

/** Writes (or refreshes) this process's row. */
export async function beat(row: HeartbeatRow, q: Db = db()): Promise<void> {
  await q("heartbeats").insert(row).onConflict("id").merge(["beat_at"]);
}

/** A process that stops on purpose takes its row with it. */
export async function removeBeat(id: string, q: Db = db()): Promise<void> {
  await q("heartbeats").where({ id }).delete();
}

/** The most recent beat of each process of a kind, newest first. */
export async function beatsOf(kind: HeartbeatKind, q: Db = db()): Promise<HeartbeatRow[]> {
  const rows = await q<HeartbeatRow>("heartbeats").select("id", "kind", "host", "pid", "started_at", "beat_at").where({ kind }).orderBy("beat_at", "desc");
  return rows.map((r) => ({ ...r, pid: Number(r.pid), started_at: new Date(r.started_at).toISOString(), beat_at: new Date(r.beat_at).toISOString() }));
}

/** Rows not refreshed since `before` belong to processes that died without saying so. */
export async function pruneBeats(before: string, q: Db = db()): Promise<number> {
  return q("heartbeats").where("beat_at", "<", before).delete();
}
