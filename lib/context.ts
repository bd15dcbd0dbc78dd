import type { Knex } from "knex";
import { db as appDb } from "@/db/index";
import { systemClock, type Clock } from "@/lib/time/clock";

/**
 * What every service use-case and every worker job runs against: the database (or a
 * transaction already open) and the clock. A long-running job also carries the worker's
 * stop signal, and checks it between batches.
 *
 * Each use-case takes it as its last parameter, `ctx: Context = {}`, and resolves it once:
 * the app passes nothing (its own database and the system clock); a test or the worker passes
 * what it wants changed. Steps inside a use-case's transaction take that transaction and the
 * one instant the use-case read from the clock, so a whole change is dated alike.
 */
export interface ServiceContext {
  db: Knex;
  clock: Clock;
  signal?: AbortSignal;
}

/** What a caller passes: any part of the context; the rest is the app's own. */
export type Context = Partial<ServiceContext>;

export function resolveContext(ctx: Context = {}): ServiceContext {
  return { db: ctx.db ?? appDb(), clock: ctx.clock ?? systemClock, signal: ctx.signal };
}
