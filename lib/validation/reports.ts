import { z } from "zod";

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, "Give a month as YYYY-MM.");

export const diversionQuerySchema = z
  .object({ from: month.optional(), to: month.optional(), by: z.enum(["month", "day"], { error: "Use by=month or by=day." }).default("month") })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ["to"], message: "The end month must not be before the start month." });
