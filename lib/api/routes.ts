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
import { cancelSchema, collectSchema, confirmSchema, createReservationSchema, declineSchema, messageSchema, noShowSchema, reviewSchema } from "@/lib/validation/reservations";

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
  { method: "post", path: "/api/moderation/role-requests/{userId}", summary: "Approve or refuse a requested role", tag: "moderation", auth: ["moderator"], body: roleDecisionSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/estimate", summary: "Quantities, water, C:N, timeline and cautions for a bed", tag: "planning", auth: "public", body: estimateSchema, errors: [400, 422] },
  { method: "post", path: "/api/blend", summary: "C:N and moisture of a mix, and water to a target", tag: "planning", auth: "public", body: blendSchema, errors: [400, 422] },
  { method: "get", path: "/api/beds", summary: "My beds", tag: "beds", auth: ["gardener"], errors: [401, 403] },
  { method: "post", path: "/api/beds", summary: "Save a bed", tag: "beds", auth: ["gardener"], body: createBedSchema, status: 201, errors: [400, 401, 403, 422] },
  { method: "get", path: "/api/beds/{id}", summary: "One of my beds with its estimate", tag: "beds", auth: ["gardener"], errors: [401, 403, 404] },
  { method: "patch", path: "/api/beds/{id}", summary: "Change a bed", tag: "beds", auth: ["gardener"], body: updateBedSchema, errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/beds/{id}", summary: "Delete a bed", tag: "beds", auth: ["gardener"], status: 204, errors: [401, 403, 404] },
  { method: "get", path: "/api/beds/{id}/calendar.ics", summary: "The bed's timeline as iCalendar", tag: "beds", auth: ["gardener"], responseDescription: "text/calendar", errors: [401, 403, 404] },
  { method: "post", path: "/api/reservations", summary: "Hold a quantity of a listing (or several, all or nothing) for a gardener", tag: "reservations", auth: ["gardener"], body: createReservationSchema, status: 201, responseDescription: "{ reservation, checkout_url? } or { reservations, checkout_url? }", errors: [400, 401, 403, 404, 409, 422] },
  { method: "get", path: "/api/reservations", summary: "My reservations (as a gardener)", tag: "reservations", auth: "signed-in", errors: [401] },
  { method: "get", path: "/api/reservations/{id}", summary: "One reservation as its gardener or supplier sees it", tag: "reservations", auth: "signed-in", errors: [401, 404] },
  { method: "post", path: "/api/reservations/{id}/confirm", summary: "Accept a held request (supplier)", tag: "reservations", auth: ["supplier", "grower", "council"], body: confirmSchema, errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/reservations/{id}/decline", summary: "Decline a held request (supplier); money is returned", tag: "reservations", auth: ["supplier", "grower", "council"], body: declineSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/cancel", summary: "Cancel (either side; a late cancellation by the gardener keeps the deposit)", tag: "reservations", auth: "signed-in", body: cancelSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/collect", summary: "Record the pickup, with the gardener's code or without (supplier)", tag: "reservations", auth: ["supplier", "grower", "council"], body: collectSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/no-show", summary: "Record that nobody came, after the pickup time (supplier); a deposit is captured", tag: "reservations", auth: ["supplier", "grower", "council"], body: noShowSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/checkout", summary: "The payment page for a reservation still to be paid", tag: "reservations", auth: ["gardener"], response: z.object({ checkout_url: z.string() }), errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/reservations/{id}/messages", summary: "The message thread of a reservation", tag: "reservations", auth: "signed-in", errors: [401, 404] },
  { method: "post", path: "/api/reservations/{id}/messages", summary: "Send a message to the other side (e-mailed; rate limited)", tag: "reservations", auth: "signed-in", body: messageSchema, status: 201, errors: [400, 401, 404, 409, 422, 429] },
  { method: "post", path: "/api/reservations/{id}/review", summary: "Rate the other side once after collection", tag: "reservations", auth: "signed-in", body: reviewSchema, status: 201, errors: [400, 401, 404, 409, 422] },
  { method: "get", path: "/api/requests", summary: "Reservations on my (or my organisation's) listings", tag: "reservations", auth: ["supplier", "grower", "council"], errors: [401, 403] },
  { method: "post", path: "/api/webhooks/stripe", summary: "Stripe's signed events (Stripe-Signature); each applied once", tag: "payments", auth: "public", errors: [400, 500] },
];
