import { z } from "zod";
import { profileSchema, signUpSchema } from "@/lib/validation/auth";
import { roleDecisionSchema } from "@/lib/validation/moderation";
import { matchSchema } from "@/lib/validation/match";

export interface RouteDoc {
  method: "get" | "post" | "patch" | "put" | "delete";
  path: string;
  summary: string;
  tag: string;
  auth: "public" | "signed-in" | string[];
  body?: z.ZodType;
  query?: z.ZodObject;
  response?: z.ZodType;
  responseDescription?: string;
  status?: number;
  errors?: number[];
}

// Every API route, documented from the schema its handler parses with. Add a line with
// each new route: the OpenAPI test fails for a route file missing here.
export const API_ROUTES: RouteDoc[] = [
  { method: "get", path: "/api/health", summary: "The app and its database answer", tag: "system", auth: "public", response: z.object({ ok: z.literal(true) }), errors: [500] },
  { method: "get", path: "/api/openapi.json", summary: "This document", tag: "system", auth: "public" },
  { method: "post", path: "/api/users", summary: "Create an account (a gardener)", tag: "accounts", auth: "public", body: signUpSchema, status: 201, errors: [400, 409, 422] },
  { method: "get", path: "/api/me", summary: "The signed-in person", tag: "accounts", auth: "signed-in", errors: [401] },
  { method: "patch", path: "/api/me", summary: "Update name, units, reminders and requested roles", tag: "accounts", auth: "signed-in", body: profileSchema, errors: [400, 401, 422] },
  { method: "get", path: "/api/council/members", summary: "Staff of my council", tag: "councils", auth: ["council"], errors: [401, 403] },
  { method: "get", path: "/api/moderation/role-requests", summary: "Roles waiting for a decision", tag: "moderation", auth: ["moderator"], errors: [401, 403] },
  { method: "post", path: "/api/match", summary: "Plan pickups: nearby listings that cover needs or a saved bed, in visiting order and carloads", tag: "matching", auth: "public", body: matchSchema, errors: [400, 401, 404, 422] },
  { method: "post", path: "/api/moderation/role-requests/{userId}", summary: "Approve or refuse a requested role", tag: "moderation", auth: ["moderator"], body: roleDecisionSchema, errors: [400, 401, 403, 404, 409, 422] },
];
