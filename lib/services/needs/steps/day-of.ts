/** The calendar day (UTC) an instant falls on: needs are dated by day. */
export const dayOf = (t: Date) => t.toISOString().slice(0, 10);
