import { z } from "zod";
import { changePasswordSchema, profileSchema, signUpSchema } from "@/lib/validation/auth";
import { roleDecisionSchema } from "@/lib/validation/moderation";
import { estimateSchema } from "@/lib/validation/estimate";
import { estimateResponseSchema } from "@/lib/validation/estimate-response";
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
import {
  addSlotsSchema,
  attendanceSchema,
  bookingSchema,
  cancelGiveawaySchema,
  createGiveawaySchema,
  giveawaySearchSchema,
  updateGiveawaySchema,
  updateSlotSchema,
} from "@/lib/validation/giveaways";
import { acceptInviteSchema, inviteSchema } from "@/lib/validation/council";
import { auditQuerySchema, closeReportSchema, listingModerationSchema, reportQueueQuerySchema, reportSchema, userModerationSchema } from "@/lib/validation/moderation";
import { diversionQuerySchema } from "@/lib/validation/reports";
import { cultureSchema, orderStepSchema, shipOrderSchema, shippingSchema } from "@/lib/validation/grower";
import { matchSchema } from "@/lib/validation/match";
import { nearestPlaceResponseSchema, nearestPlaceSchema, placeSearchResponseSchema, placeSearchSchema } from "@/lib/validation/places";
import {
  councilDemandQuerySchema,
  listAlertsQuerySchema,
  listNeedsQuerySchema,
  nearbyDemandQuerySchema,
  nearbyDemandResponseSchema,
  needResponseSchema,
  openNeedSchema,
  updateAlertSchema,
  updateNeedSchema,
} from "@/lib/validation/needs";

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
  /** Honours an Idempotency-Key header (lib/api/idempotency.ts). */
  idempotent?: boolean;
}

// Every API route, documented from the schema its handler parses with. Add a line with
// each new route: the OpenAPI test fails for a route file missing here.
export const API_ROUTES: RouteDoc[] = [
  { method: "get", path: "/api/health", summary: "The app and its database answer", tag: "system", auth: "public", response: z.object({ ok: z.literal(true) }), errors: [500] },
  {
    method: "get",
    path: "/api/health/ready",
    summary: "Whether this process can serve everything now: the database takes a write, a worker beat within a minute, the outbox is moving, and the mail server, Stripe and Cloudinary answer",
    tag: "system",
    auth: "public",
    response: z.object({ ok: z.boolean(), checks: z.record(z.string(), z.looseObject({ ok: z.boolean() })) }),
    responseDescription: "Ready: every check ok. Not ready is a 503 with the same shape, ok: false and the failing checks ok: false",
  },
  { method: "get", path: "/api/openapi.json", summary: "This document", tag: "system", auth: "public" },
  { method: "post", path: "/api/users", summary: "Join: the same answer whether or not the address has an account; the e-mail sent says which (a confirmation link, or how to sign in). Limited per client address", tag: "accounts", auth: "public", body: signUpSchema, status: 202, errors: [400, 413, 415, 422, 429] },
  { method: "post", path: "/api/me/password", summary: "Change the password (checks the current one); ends every session of the account", tag: "accounts", auth: "signed-in", body: changePasswordSchema, errors: [400, 401, 415, 422, 429] },
  { method: "delete", path: "/api/me/sessions", summary: "Sign out everywhere: ends every session of the account", tag: "accounts", auth: "signed-in", errors: [401] },
  { method: "post", path: "/api/me/confirmation", summary: "Send the e-mail address confirmation link again", tag: "accounts", auth: "signed-in", status: 202, errors: [401, 409, 429] },
  { method: "get", path: "/api/me", summary: "The signed-in person", tag: "accounts", auth: "signed-in", errors: [401] },
  { method: "patch", path: "/api/me", summary: "Update name, units, home place, reminders and requested roles", tag: "accounts", auth: "signed-in", body: profileSchema, errors: [400, 401, 422] },
  { method: "get", path: "/api/council/members", summary: "Staff of my council", tag: "councils", auth: ["council"], errors: [401, 403] },
  { method: "get", path: "/api/moderation/role-requests", summary: "Roles waiting for a decision", tag: "moderation", auth: ["moderator"], errors: [401, 403] },
  { method: "get", path: "/api/places", summary: "Places, streets and postcodes whose name starts with q, best first, each with its point: the local gazetteer, then the geocoding service when one is set", tag: "places", auth: "public", query: placeSearchSchema, response: placeSearchResponseSchema, errors: [422] },
  { method: "get", path: "/api/places/nearest", summary: "A name for a point (the nearest known place), for \"use where I am\"", tag: "places", auth: "public", query: nearestPlaceSchema, response: nearestPlaceResponseSchema, errors: [422] },
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
  { method: "post", path: "/api/estimate", summary: "Quantities, the first soak as a range, C:N advice a bed can follow, timeline with planting dates, settling and top-ups, cautions; with a plan or a match, what the bed will cost", tag: "planning", auth: "public", body: estimateSchema, response: estimateResponseSchema, errors: [400, 422] },
  { method: "post", path: "/api/blend", summary: "C:N and moisture of a mix, and water to a target", tag: "planning", auth: "public", body: blendSchema, errors: [400, 422] },
  { method: "get", path: "/api/beds", summary: "My beds", tag: "beds", auth: ["gardener"], errors: [401, 403] },
  { method: "post", path: "/api/beds", summary: "Save a bed", tag: "beds", auth: ["gardener"], body: createBedSchema, status: 201, errors: [400, 401, 403, 422] },
  { method: "get", path: "/api/beds/{id}", summary: "One of my beds with its estimate", tag: "beds", auth: ["gardener"], errors: [401, 403, 404] },
  { method: "patch", path: "/api/beds/{id}", summary: "Change a bed", tag: "beds", auth: ["gardener"], body: updateBedSchema, errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/beds/{id}", summary: "Delete a bed", tag: "beds", auth: ["gardener"], status: 204, errors: [401, 403, 404] },
  { method: "get", path: "/api/beds/{id}/calendar.ics", summary: "The bed's timeline as iCalendar", tag: "beds", auth: ["gardener"], responseDescription: "text/calendar", errors: [401, 403, 404] },
  { method: "post", path: "/api/reservations", idempotent: true, summary: "Hold a quantity of a listing (or several, all or nothing) for a gardener", tag: "reservations", auth: ["gardener"], body: createReservationSchema, status: 201, responseDescription: "{ reservation, checkout_url? } or { reservations, checkout_url? }", errors: [400, 401, 403, 404, 409, 422] },
  { method: "get", path: "/api/reservations", summary: "My reservations (as a gardener)", tag: "reservations", auth: "signed-in", errors: [401] },
  { method: "get", path: "/api/reservations/{id}", summary: "One reservation as its gardener or supplier sees it", tag: "reservations", auth: "signed-in", errors: [401, 404] },
  { method: "post", path: "/api/reservations/{id}/confirm", idempotent: true, summary: "Accept a held request (supplier)", tag: "reservations", auth: ["supplier", "grower", "council"], body: confirmSchema, errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/reservations/{id}/decline", idempotent: true, summary: "Decline a held request (supplier); money is returned", tag: "reservations", auth: ["supplier", "grower", "council"], body: declineSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/cancel", idempotent: true, summary: "Cancel (either side; a late cancellation by the gardener keeps the deposit)", tag: "reservations", auth: "signed-in", body: cancelSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/collect", idempotent: true, summary: "Record the pickup, with the gardener's code or without (supplier)", tag: "reservations", auth: ["supplier", "grower", "council"], body: collectSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/no-show", idempotent: true, summary: "Record that nobody came, after the pickup time (supplier); a deposit is captured", tag: "reservations", auth: ["supplier", "grower", "council"], body: noShowSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/checkout", idempotent: true, summary: "The payment page for a reservation still to be paid", tag: "reservations", auth: ["gardener"], response: z.object({ checkout_url: z.string() }), errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/reservations/{id}/messages", summary: "The message thread of a reservation", tag: "reservations", auth: "signed-in", errors: [401, 404] },
  { method: "post", path: "/api/reservations/{id}/messages", summary: "Send a message to the other side (e-mailed; rate limited)", tag: "reservations", auth: "signed-in", body: messageSchema, status: 201, errors: [400, 401, 404, 409, 422, 429] },
  { method: "post", path: "/api/reservations/{id}/pack", idempotent: true, summary: "A paid, posted live culture is packed (grower); the buyer is e-mailed", tag: "reservations", auth: ["supplier", "grower", "council"], body: orderStepSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/ship", idempotent: true, summary: "A packed culture is in the post, with carrier and tracking (grower; not while posting is paused)", tag: "reservations", auth: ["supplier", "grower", "council"], body: shipOrderSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/deliver", idempotent: true, summary: "A shipped culture arrived (buyer, or grower from the tracking); closes the order", tag: "reservations", auth: "signed-in", body: orderStepSchema, errors: [400, 401, 404, 409, 422] },
  { method: "post", path: "/api/reservations/{id}/review", summary: "Rate the other side once after collection", tag: "reservations", auth: "signed-in", body: reviewSchema, status: 201, errors: [400, 401, 404, 409, 422] },
  { method: "get", path: "/api/requests", summary: "Reservations on my (or my organisation's) listings", tag: "reservations", auth: ["supplier", "grower", "council"], errors: [401, 403] },
  { method: "post", path: "/api/webhooks/stripe", summary: "Stripe's signed events (Stripe-Signature); each applied once", tag: "payments", auth: "public", errors: [400, 500] },
  { method: "get", path: "/api/giveaways", summary: "Upcoming council giveaway days near a point (approximate places)", tag: "giveaways", auth: "public", query: giveawaySearchSchema, errors: [422] },
  { method: "get", path: "/api/giveaways/{id}", summary: "One giveaway day; my booking and the exact place once booked", tag: "giveaways", auth: "public", errors: [404] },
  { method: "post", path: "/api/giveaways/{id}/bookings", idempotent: true, summary: "Book a slot for my household", tag: "giveaways", auth: "signed-in", body: bookingSchema, status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/giveaways/{id}/bookings/{bookingId}", idempotent: true, summary: "Cancel my booking before the cut-off", tag: "giveaways", auth: "signed-in", errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/giveaways/{id}/bookings/{bookingId}/calendar.ics", summary: "My booked slot as iCalendar (session or e-mailed token t)", tag: "giveaways", auth: "public", responseDescription: "text/calendar", errors: [404, 409] },
  { method: "get", path: "/api/council/giveaways", summary: "My council's giveaway days", tag: "councils", auth: ["council"], errors: [401, 403] },
  { method: "post", path: "/api/council/giveaways", summary: "Create a giveaway day with its slots", tag: "councils", auth: ["council"], body: createGiveawaySchema, status: 201, errors: [400, 401, 403, 422] },
  { method: "get", path: "/api/council/giveaways/{id}", summary: "A day's sheet: the day and everyone booked", tag: "councils", auth: ["council"], errors: [401, 403, 404] },
  { method: "patch", path: "/api/council/giveaways/{id}", summary: "Change a giveaway day", tag: "councils", auth: ["council"], body: updateGiveawaySchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/council/giveaways/{id}/cancel", idempotent: true, summary: "Call a day off; everyone booked is e-mailed", tag: "councils", auth: ["council"], body: cancelGiveawaySchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/council/giveaways/{id}/slots", summary: "Add time slots", tag: "councils", auth: ["council"], body: addSlotsSchema, status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "patch", path: "/api/council/giveaways/{id}/slots/{slotId}", summary: "Change a slot's capacity", tag: "councils", auth: ["council"], body: updateSlotSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/council/giveaways/{id}/slots/{slotId}", summary: "Remove a slot nobody has booked", tag: "councils", auth: ["council"], status: 204, errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/council/giveaways/{id}/sheet.csv", summary: "The day's sheet as CSV", tag: "councils", auth: ["council"], responseDescription: "text/csv", errors: [401, 403, 404] },
  { method: "patch", path: "/api/council/giveaways/{id}/bookings/{bookingId}", idempotent: true, summary: "Check a household in, undo it, or mark a no-show", tag: "councils", auth: ["council"], body: attendanceSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "get", path: "/api/council/invites", summary: "Staff invitations waiting for an answer", tag: "councils", auth: ["council"], errors: [401, 403] },
  { method: "post", path: "/api/council/invites", summary: "Invite a colleague by e-mail (owner)", tag: "councils", auth: ["council"], body: inviteSchema, status: 201, errors: [400, 401, 403, 409, 422] },
  { method: "delete", path: "/api/council/invites/{id}", summary: "Withdraw an invitation (owner)", tag: "councils", auth: ["council"], errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/council/invites/accept", summary: "Accept an invitation with the invited address", tag: "councils", auth: "signed-in", body: acceptInviteSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/council/members/{userId}", summary: "Remove a staff member (owner)", tag: "councils", auth: ["council"], errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/reports", summary: "Report a listing or a person to the moderators", tag: "moderation", auth: "signed-in", body: reportSchema, status: 201, errors: [400, 401, 403, 404, 422, 429] },
  { method: "get", path: "/api/moderation/reports", summary: "The report queue with context", tag: "moderation", auth: ["moderator"], query: reportQueueQuerySchema, errors: [401, 403, 422] },
  { method: "post", path: "/api/moderation/reports/{id}/close", summary: "Close a report with a note; the reporter is e-mailed", tag: "moderation", auth: ["moderator"], body: closeReportSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/moderation/listings/{id}", summary: "Hide a listing or show it again", tag: "moderation", auth: ["moderator"], body: listingModerationSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/moderation/users/{id}", summary: "Suspend, restore, verify or unverify an account", tag: "moderation", auth: ["moderator"], body: userModerationSchema, errors: [400, 401, 403, 404, 409, 422] },
  { method: "get", path: "/api/moderation/audit", summary: "The append-only audit log, newest first", tag: "moderation", auth: ["moderator"], query: auditQuerySchema, errors: [401, 403, 422] },
  { method: "get", path: "/api/reports/diversion", summary: "kg and m³ that left my or my organisation's hands, by month and material", tag: "reports", auth: ["supplier", "grower", "council"], query: diversionQuerySchema, errors: [401, 403, 422] },
  { method: "get", path: "/api/reports/diversion.csv", summary: "The diversion figures as CSV", tag: "reports", auth: ["supplier", "grower", "council"], query: diversionQuerySchema, responseDescription: "text/csv", errors: [401, 403, 422] },
  { method: "get", path: "/api/grower/orders", summary: "My open live-culture orders (to answer, pack, post, or on their way), posting days and the next one", tag: "growers", auth: ["grower"], responseDescription: "{ orders, shipping, next_posting_day }", errors: [401, 403] },
  { method: "get", path: "/api/grower/shipping", summary: "My shipping weekdays and pause", tag: "growers", auth: ["grower"], errors: [401, 403] },
  { method: "put", path: "/api/grower/shipping", summary: "Set shipping weekdays; pause posting in heat or frost", tag: "growers", auth: ["grower"], body: shippingSchema, errors: [400, 401, 403, 422] },
  { method: "put", path: "/api/grower/listings/{id}/culture", summary: "Species (required), posting and collection of a worm listing", tag: "growers", auth: ["grower"], body: cultureSchema, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/needs", summary: "My needs, newest first (only mine: nobody else's need is ever shown)", tag: "needs", auth: "signed-in", query: listNeedsQuerySchema, response: z.object({ needs: z.array(needResponseSchema) }), errors: [401, 422] },
  { method: "post", path: "/api/needs", summary: "Open a need: a saved bed's unmet layer (bed_id) or a typed one (location); alerts come when a listing that could serve it appears", tag: "needs", auth: ["gardener"], body: openNeedSchema, status: 201, response: z.object({ need: needResponseSchema }), errors: [400, 401, 403, 409, 415, 422] },
  { method: "get", path: "/api/needs/{id}", summary: "One of my needs", tag: "needs", auth: "signed-in", response: z.object({ need: needResponseSchema }), errors: [401, 404] },
  { method: "patch", path: "/api/needs/{id}", summary: "Change the amount, radius, date, place or alerts of my need; close it, or open it again", tag: "needs", auth: "signed-in", body: updateNeedSchema, response: z.object({ need: needResponseSchema }), errors: [400, 401, 404, 409, 415, 422] },
  { method: "delete", path: "/api/needs/{id}", summary: "Delete my need and its alerts", tag: "needs", auth: "signed-in", status: 204, errors: [401, 404] },
  { method: "get", path: "/api/needs/nearby-demand", summary: "Open needs a listing of a material at a point would serve within 5, 10 and 25 km: rounded, anonymous counts, and sums only where at least 3 people make them up", tag: "needs", auth: "signed-in", query: nearbyDemandQuerySchema, response: nearbyDemandResponseSchema, errors: [401, 422, 429] },
  { method: "get", path: "/api/needs/alerts", summary: "Listings found for my open needs (the in-app notices)", tag: "needs", auth: "signed-in", query: listAlertsQuerySchema, responseDescription: "{ alerts }", errors: [401, 422] },
  { method: "patch", path: "/api/needs/alerts/{id}", summary: "Mark one of my notices seen, or dismiss it", tag: "needs", auth: "signed-in", body: updateAlertSchema, status: 204, errors: [400, 401, 404, 415, 422] },
  { method: "get", path: "/api/council/demand", summary: "Open needs around my council by cell (at least 1 km², each figure from at least 3 people) and a giveaway-day suggestion", tag: "councils", auth: ["council"], query: councilDemandQuerySchema, responseDescription: "{ centre, radius_km, material, cells, materials, suggestion }", errors: [401, 403, 422] },
  { method: "get", path: "/api/council/demand.csv", summary: "The demand map's cells as CSV", tag: "councils", auth: ["council"], query: councilDemandQuerySchema, responseDescription: "text/csv", errors: [401, 403, 422] },
  { method: "get", path: "/api/growers/{id}/shipping", summary: "A grower's shipping days and pause, for buyers", tag: "growers", auth: "public", errors: [404] },
];
