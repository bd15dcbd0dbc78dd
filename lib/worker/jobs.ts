import { pruneIdempotencyKeys } from "@/db/idempotency-keys";
import { deliverOutbox } from "@/lib/mail/deliver-outbox";
import { settlePayments } from "@/lib/services/payments/settle-due-payments";
import { recoverOpenPayments } from "@/lib/services/payments/recover-open-payments";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { sendReservationReminders } from "@/lib/services/reservations/send-reservation-reminders";
import { expireListings } from "@/lib/services/listings/expire-listings";
import { expireGiveawayDepositHolds } from "@/lib/services/giveaways/expire-deposit-holds";
import { sendBedReminders } from "@/lib/services/beds/send-bed-reminders";
import { pruneSecurityRecords } from "@/lib/services/accounts/prune-security-records";
import { alertDueListings } from "@/lib/services/needs/alert-due-listings";
import { sendNeedDigests } from "@/lib/services/needs/send-need-digests";
import { expireOpenNeeds } from "@/lib/services/needs/close-needs";
import { systemClock } from "@/lib/time/clock";

import type { Context } from "@/lib/context";

/** What the worker gives each job: the services' context (its database, its clock, the signal
 * that says "stop taking new work") and its own name, for the rows it claims. */
export type JobContext = Context & { workerId?: string };

export interface Job {
  name: string;
  everyMs: number;
  run: (ctx: JobContext) => Promise<unknown>;
}

// Background work; each job keeps its state in the database, so a restart loses nothing.
export const jobs: Job[] = [
  { name: "deliver-outbox", everyMs: 2_000, run: (ctx) => deliverOutbox(ctx) },
  // Reads already treat a listing past its end date as expired; this makes the row say so.
  { name: "expire-listings", everyMs: 60_000, run: (ctx) => expireListings(ctx) },
  { name: "bed-reminders", everyMs: 60_000, run: (ctx) => sendBedReminders(ctx) },
  { name: "expire-holds", everyMs: 15_000, run: (ctx) => expireHolds(ctx) },
  // Giveaway bookings whose no-show deposit was not put down within the hold.
  { name: "expire-giveaway-deposits", everyMs: 15_000, run: (ctx) => expireGiveawayDepositHolds(ctx) },
  { name: "reservation-reminders", everyMs: 60_000, run: (ctx) => sendReservationReminders(ctx) },
  // Listings posted, restocked, changed or come into their dates, against the open needs
  // (the services alert at once; this is the net, and the only path for a start date arriving).
  { name: "alert-needs", everyMs: 30_000, run: (ctx) => alertDueListings(ctx) },
  // Daily alerts: one e-mail a person, at most once in 24 hours.
  { name: "need-digests", everyMs: 5 * 60_000, run: (ctx) => sendNeedDigests(ctx) },
  { name: "expire-needs", everyMs: 10 * 60_000, run: (ctx) => expireOpenNeeds(ctx) },
  // Ended sessions and spent rate-limit windows are kept a while for support, then dropped.
  { name: "prune-security-records", everyMs: 60 * 60_000, run: (ctx) => pruneSecurityRecords(ctx) },
  // Owed Stripe calls, then the lost-webhook net: checkouts still open after a few minutes
  // are checked against Stripe's record and brought up to it.
  {
    name: "settle-payments",
    everyMs: 5_000,
    run: async (ctx) => ({ ...(await settlePayments(ctx)), ...(await recoverOpenPayments({}, ctx)) }),
  },
  // First answers kept for Idempotency-Key retries live a day.
  { name: "prune-idempotency-keys", everyMs: 60 * 60_000, run: async (ctx) => ({ pruned: await pruneIdempotencyKeys((ctx.clock ?? systemClock)().toISOString(), ctx.db) }) },
];
