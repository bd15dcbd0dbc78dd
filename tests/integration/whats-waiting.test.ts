// The signed-in home: each role sees what waits for it, counted from the real rows.
import { beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { createListing, createReservation, createUser } from "../factories";
import { loadSessionUser } from "@/lib/auth/current-user";
import { whatsWaiting } from "@/lib/services/accounts/get-whats-waiting";
import { afterSignInPath } from "@/lib/auth/callback-url";

const byId = async (id: string) => {
  const user = await loadSessionUser(id);
  const sections = await whatsWaiting(user!);
  return Object.fromEntries(sections.map((s) => [s.id, s]));
};

let supplierId: string;
let gardenerId: string;
let payerId: string;

beforeAll(async () => {
  await freshDb();
  supplierId = (await createUser({ roles: ["supplier"] })).id;
  gardenerId = (await createUser({ roles: ["gardener"] })).id;
  payerId = (await createUser({ roles: ["gardener"] })).id;
  const free = await createListing({ owner_id: supplierId });
  const priced = await createListing({ owner_id: supplierId, price_cents: 400 });
  // One request to answer, one confirmed pickup, one checkout still owed (not the supplier's to answer yet).
  await createReservation({ status: "held", listing_id: free.id, gardener_id: gardenerId });
  await createReservation({ status: "confirmed", listing_id: free.id, gardener_id: gardenerId, pickup_at: new Date().toISOString() });
  await createReservation({ status: "held", listing_id: priced.id, gardener_id: payerId, payment_state: "awaiting" });
});

describe("what is waiting", () => {
  it("gives a supplier the requests to answer, not the ones still waiting for the gardener's payment", async () => {
    const s = await byId(supplierId);
    expect(s["to-answer"].count).toBe(1);
    expect(s["to-answer"].items[0].href).toMatch(/^\/reservations\//);
    expect(s["to-pay"]).toBeUndefined();
  });

  it("gives a gardener their confirmed pickups and the requests waiting for an answer", async () => {
    const s = await byId(gardenerId);
    expect(s["to-collect"].count).toBe(1);
    expect(s["awaiting-answer"].count).toBe(1);
    expect(s["to-pay"].count).toBe(0);
    expect(s["to-answer"]).toBeUndefined();
  });

  it("gives a gardener who owes a checkout the payment to make", async () => {
    const s = await byId(payerId);
    expect(s["to-pay"].count).toBe(1);
    expect(s["awaiting-answer"].count).toBe(0);
  });

  it("gives a moderator the open reports and a person with no roles nothing", async () => {
    const mod = await createUser({ roles: ["moderator"] });
    const s = await byId(mod.id);
    expect(Object.keys(s).sort()).toEqual(["reports", "role-requests"]);
    const none = await createUser({ roles: [] });
    expect(await whatsWaiting((await loadSessionUser(none.id))!)).toEqual([]);
  });
});

describe("where signing in leads", () => {
  it("to what is waiting from the public home or from nowhere, else back where the person was", () => {
    expect(afterSignInPath(undefined)).toBe("/home");
    expect(afterSignInPath("/")).toBe("/home");
    expect(afterSignInPath("/listings/abc/reserve")).toBe("/listings/abc/reserve");
    expect(afterSignInPath("https://elsewhere.example/")).toBe("/home");
  });
});
