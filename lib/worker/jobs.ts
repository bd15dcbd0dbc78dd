import { deliverOutbox } from "@/lib/mail/deliver-outbox";
import { settlePayments } from "@/lib/payments/actions";
import { expireHolds, sendReservationReminders } from "@/lib/services/expire-holds";

export type Clock = () => Date;

export interface Job {
  name: string;
  everyMs: number;
  run: (clock: Clock) => Promise<unknown>;
}

// Background work; each job keeps its state in the database, so a restart loses nothing.
// Later features add theirs here (timeline reminders).
export const jobs: Job[] = [
  { name: "deliver-outbox", everyMs: 2_000, run: (clock) => deliverOutbox(clock) },
  { name: "expire-holds", everyMs: 15_000, run: (clock) => expireHolds(clock) },
  { name: "reservation-reminders", everyMs: 60_000, run: (clock) => sendReservationReminders(clock) },
  { name: "settle-payments", everyMs: 5_000, run: (clock) => settlePayments(clock) },
];
