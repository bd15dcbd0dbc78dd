import type { Knex } from "knex";
import { db } from "@/db/index";

/** What every needs service and job runs against: a database (or transaction) and a clock. */
export interface NeedsContext {
  db?: Knex;
  clock?: () => Date;
}

export function resolveContext(ctx: NeedsContext = {}): { q: Knex; clock: () => Date } {
  return { q: ctx.db ?? db(), clock: ctx.clock ?? (() => new Date()) };
}

/** The calendar day (UTC) an instant falls on: needs are dated by day. */
export const dayOf = (t: Date) => t.toISOString().slice(0, 10);
