import { z } from "zod";
import { profileSchema, signUpSchema } from "@/lib/validation/auth";
import { roleDecisionSchema } from "@/lib/validation/moderation";
import { estimateSchema } from "@/lib/validation/estimate";
import { blendSchema } from "@/lib/validation/blend";
import { createBedSchema, updateBedSchema } from "@/lib/validation/beds";
import {
  addPhotosSchema,
  browseQuerySchema,
  browseResponseSchema,
  createListingSchema,
  listingStatusSchema,
  removePhotoSchema,
  reorderPhotosSchema,
  updateListingSchema,
} from "@/lib/validation/listings";
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
  { method: "get", path: "/api/listings", summary: "Active listings with quantity left, nearest first around a point (approximate locations)", tag: "listings", auth: "public", query: browseQuerySchema, response: browseResponseSchema, errors: [422] },
  { method: "post", path: "/api/listings", summary: "Post a listing (with verified photo uploads)", tag: "listings", auth: ["supplier", "grower", "council"], body: createListingSchema, status: 201, errors: [400, 401, 403, 422] },
  { method: "get", path: "/api/listings/{id}", summary: "One listing; the exact pickup point and address only to those who manage it", tag: "listings", auth: "public", errors: [404] },
  { method: "patch", path: "/api/listings/{id}", summary: "Edit a listing you manage", tag: "listings", auth: ["supplier", "grower", "council"], body: updateListingSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/listings/{id}/status", summary: "Publish, pause, resume or archive a listing you manage", tag: "listings", auth: ["supplier", "grower", "council"], body: listingStatusSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/listings/{id}/photos", summary: "Attach uploaded photos (signature verified; at most 6)", tag: "listings", auth: ["supplier", "grower", "council"], body: addPhotosSchema, status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/listings/{id}/photos", summary: "Remove a photo", tag: "listings", auth: ["supplier", "grower", "council"], body: removePhotoSchema, errors: [400, 401, 403, 404, 422] },
  { method: "patch", path: "/api/listings/{id}/photos", summary: "Reorder photos; the first is the cover", tag: "listings", auth: ["supplier", "grower", "council"], body: reorderPhotosSchema, errors: [400, 401, 403, 404, 422] },
  { method: "post", path: "/api/media/sign", summary: "Sign one browser upload of a listing photo", tag: "listings", auth: ["supplier", "grower", "council"], errors: [401, 403] },
  { method: "post", path: "/api/match", summary: "Plan pickups: nearby listings that cover needs or a saved bed, in visiting order and carloads", tag: "matching", auth: "public", body: matchSchema, errors: [400, 401, 404, 422] },
  { method: "post", path: "/api/moderation/role-requests/{userId}", summary: "Approve or refuse a requested role", tag: "moderation", auth: ["moderator"], body: roleDecisionSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/estimate", summary: "Quantities, water, C:N, timeline and cautions for a bed", tag: "planning", auth: "public", body: estimateSchema, errors: [400, 422] },
  { method: "post", path: "/api/blend", summary: "C:N and moisture of a mix, and water to a target", tag: "planning", auth: "public", body: blendSchema, errors: [400, 422] },
  { method: "get", path: "/api/beds", summary: "My beds", tag: "beds", auth: ["gardener"], errors: [401, 403] },
  { method: "post", path: "/api/beds", summary: "Save a bed", tag: "beds", auth: ["gardener"], body: createBedSchema, status: 201, errors: [400, 401, 403, 422] },
  { method: "get", path: "/api/beds/{id}", summary: "One of my beds with its estimate", tag: "beds", auth: ["gardener"], errors: [401, 403, 404] },
  { method: "patch", path: "/api/beds/{id}", summary: "Change a bed", tag: "beds", auth: ["gardener"], body: updateBedSchema, errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/beds/{id}", summary: "Delete a bed", tag: "beds", auth: ["gardener"], status: 204, errors: [401, 403, 404] },
  { method: "get", path: "/api/beds/{id}/calendar.ics", summary: "The bed's timeline as iCalendar", tag: "beds", auth: ["gardener"], responseDescription: "text/calendar", errors: [401, 403, 404] },
];
