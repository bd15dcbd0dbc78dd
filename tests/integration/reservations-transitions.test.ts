// Every transition route × every party × every state, from one explicit table of what
// must be allowed. The expectations are written out here by hand, not derived from the
// policy module the routes use, so a wrong rule in either shows up as a failing cell.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createReservation, createUser, listingQuantities } from "../factories";
import { POST as confirm } from "@/app/api/reservations/[id]/confirm/route";
import { POST as decline } from "@/app/api/reservations/[id]/decline/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";
import { POST as collect } from "@/app/api/reservations/[id]/collect/route";
import { POST as noShow } from "@/app/api/reservations/[id]/no-show/route";
import { db } from "@/db/index";

const ROUTES = { confirm, decline, cancel, collect, "no-show": noShow } as const;
type Route = keyof typeof ROUTES;
const TARGET: Record<Route, string> = { confirm: "confirmed", decline: "declined", cancel: "cancelled", collect: "collected", "no-show": "no_show" };

const STATES = ["held", "held_unpaid", "confirmed", "confirmed_past", "collected", "declined", "cancelled", "expired", "no_show"] as const;
type State = (typeof STATES)[number];

// gardener: made the reservation; dual: made it too, and also supplies (so passes the role check);
// owner: owns the listing; staff: another member of the listing's organisation;
// otherSupplier / otherGardener: strangers to it; anonymous: not signed in.
const PARTIES = ["gardener", "dual", "owner", "staff", "otherSupplier", "otherGardener", "anonymous"] as const;
type Party = (typeof PARTIES)[number];

const SUPPLIER_SIDE_OK: Record<Exclude<Route, "cancel">, State[]> = {
  confirm: ["held"], // not while the gardener still owes the payment
  decline: ["held", "held_unpaid"],
  collect: ["confirmed", "confirmed_past"],
  "no-show": ["confirmed_past"], // only after the pickup time
};
const CANCEL_OK: State[] = ["held", "held_unpaid", "confirmed", "confirmed_past"];

function expected(route: Route, party: Party, state: State): number {
  if (party === "anonymous") return 401;
  const supplierRoute = route !== "cancel";
  const supplies = ["dual", "owner", "staff", "otherSupplier"].includes(party);
  if (supplierRoute && !supplies) return 403; // a gardener-only account
  if (party === "otherSupplier" || party === "otherGardener") return 404;
  if (route === "cancel") return CANCEL_OK.includes(state) ? 200 : 409;
  if (party === "gardener" || party === "dual") return 403; // their own reservation, the supplier's move
  return SUPPLIER_SIDE_OK[route].includes(state) ? 200 : 409;
}

let ctx: Awaited<ReturnType<typeof freshDb>>;
const people = {} as Record<Exclude<Party, "anonymous">, string>;
let organisationId: string | undefined;

beforeAll(async () => {
  ctx = await freshDb();
  const owner = await createUser({ roles: ["council", "supplier"] });
  people.owner = owner.id;
  people.staff = (await createUser({ roles: ["council"], organisation_id: owner.organisation_id })).id;
  people.gardener = (await createUser({ roles: ["gardener"] })).id;
  people.dual = (await createUser({ roles: ["gardener", "supplier"] })).id;
  people.otherSupplier = (await createUser({ roles: ["supplier"] })).id;
  people.otherGardener = (await createUser({ roles: ["gardener"] })).id;
  organisationId = owner.organisation_id;
});
afterAll(() => ctx.close());

async function reservationIn(state: State, gardenerId: string) {
  const l = await createListing({ owner_id: people.owner, organisation_id: organisationId, quantity_total: 5 });
  const past = new Date(Date.now() - 3_600_000).toISOString();
  const status = state === "held_unpaid" ? "held" : state === "confirmed_past" ? "confirmed" : state;
  const r = await createReservation({
    status,
    listing_id: l.id,
    gardener_id: gardenerId,
    quantity: 2,
    payment_state: state === "held_unpaid" ? "awaiting" : "none",
    pickup_by: state === "confirmed_past" ? past : undefined,
  });
  return { listingId: l.id, ...r };
}

describe("transition matrix", () => {
  for (const route of Object.keys(ROUTES) as Route[]) {
    describe(`POST /api/reservations/:id/${route}`, () => {
      for (const party of PARTIES) {
        it(`as ${party}`, async () => {
          const rows: string[] = [];
          for (const state of STATES) {
            const r = await reservationIn(state, party === "dual" ? people.dual : people.gardener);
            const before = await listingQuantities(r.listingId);
            const as = party === "anonymous" ? null : party === "dual" ? people.dual : people[party];
            const res = await call(ROUTES[route] as any, await request(`/api/reservations/${r.id}/${route}`, { as, body: {} }), { id: r.id });
            const want = expected(route, party, state);
            const after = await db()("reservations").first("status").where({ id: r.id });
            const quantities = await listingQuantities(r.listingId);
            const ok =
              res.status === want &&
              (want === 200 ? after.status === TARGET[route] && res.json.reservation.status === TARGET[route] : after.status === (state === "held_unpaid" ? "held" : state === "confirmed_past" ? "confirmed" : state) && JSON.stringify(quantities) === JSON.stringify(before)) &&
              (want === 200 || typeof res.json?.error?.code === "string");
            if (!ok) rows.push(`${state}: got ${res.status} (${res.json?.error?.code ?? after.status}), want ${want}`);
          }
          expect(rows).toEqual([]);
        });
      }
    });
  }

  it("uses invalid_state for the 409s and forbidden for the wrong side", async () => {
    const done = await reservationIn("collected", people.gardener);
    const res = await call(confirm as any, await request(`/x`, { as: people.owner, body: {} }), { id: done.id });
    expect(res.json.error.code).toBe("invalid_state");
    const mine = await reservationIn("held", people.dual);
    const wrongSide = await call(confirm as any, await request(`/x`, { as: people.dual, body: {} }), { id: mine.id });
    expect([wrongSide.status, wrongSide.json.error.code]).toEqual([403, "forbidden"]);
  });
});

describe("what each transition does to the listing", () => {
  it("collect moves held to collected; decline, cancel and no-show give it back", async () => {
    for (const [route, state, held, collected] of [
      ["collect", "confirmed", 0, 2],
      ["decline", "held", 0, 0],
      ["cancel", "confirmed", 0, 0],
      ["no-show", "confirmed_past", 0, 0],
      ["confirm", "held", 2, 0],
    ] as const) {
      const r = await reservationIn(state, people.gardener);
      const res = await call(ROUTES[route] as any, await request(`/x`, { as: people.owner, body: {} }), { id: r.id });
      expect(res.status, route).toBe(200);
      expect(await listingQuantities(r.listingId), route).toMatchObject({ quantity_held: held, quantity_collected: collected });
    }
  });

  it("checks a typed pickup code, ignoring case and spaces, and refuses a wrong one", async () => {
    const r = await reservationIn("confirmed", people.gardener); // the factory's code is ABC234
    const wrong = await call(collect as any, await request(`/x`, { as: people.owner, body: { pickup_code: "ZZZ999" } }), { id: r.id });
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.fields.pickup_code).toMatch(/\S/);
    const right = await call(collect as any, await request(`/x`, { as: people.staff, body: { pickup_code: "abc 234" } }), { id: r.id });
    expect(right.status).toBe(200);
    const history = await db()("reservation_events").where({ reservation_id: r.id }).orderBy("id").first("note", "actor_id");
    expect(history).toMatchObject({ note: "Pickup code checked", actor_id: people.staff });
  });

  it("refuses a reason that is too long, and bad JSON", async () => {
    const r = await reservationIn("held", people.gardener);
    const long = await call(decline as any, await request(`/x`, { as: people.owner, body: { reason: "x".repeat(501) } }), { id: r.id });
    expect([long.status, Object.keys(long.json.error.fields)]).toEqual([422, ["reason"]]);
    const bad = await call(decline as any, await request(`/x`, { as: people.owner, rawBody: "{" }), { id: r.id });
    expect(bad.status).toBe(400);
  });
});
