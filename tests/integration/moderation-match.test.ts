// A moderator's hide, through its route, takes the listing out of matching (POST /api/match)
// at once; restoring puts it back. The listing starts active, so only the hide can remove it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser } from "../factories";
import { FERNHOLLOW } from "../helpers/match";
import * as match from "@/app/api/match/route";
import * as listingMod from "@/app/api/moderation/listings/[id]/route";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let moderator = "";
let reported = "";
let neighbour = "";

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  moderator = (await createUser({ roles: ["moderator"] })).id;
  const supplier = (await createUser({ roles: ["supplier"] })).id;
  const near = { lat: FERNHOLLOW.lat + 0.004, lng: FERNHOLLOW.lng + 0.004 };
  const further = { lat: FERNHOLLOW.lat + 0.03, lng: FERNHOLLOW.lng - 0.03 };
  reported = (await createListing({ owner_id: supplier, material_code: "leaves", unit: "m3", location: near, quantity_total: 2, title: "Leaves with litter in" })).id;
  neighbour = (await createListing({ owner_id: supplier, material_code: "leaves", unit: "m3", location: further, quantity_total: 2, title: "Clean leaves further out" })).id;
});
afterAll(() => ctx.close());

const NEED = { needs: [{ material: "leaves", quantity: 0.5, unit: "m3" }], origin: FERNHOLLOW, radius_km: 15 };
async function matched(): Promise<string[]> {
  const res = await call(match.POST as never, await request("/api/match", { body: NEED }));
  expect(res.status, JSON.stringify(res.json)).toBe(200);
  const ids = [...res.json.allocations.map((a: { listing_id: string }) => a.listing_id), ...res.json.stops.map((s: { listing_id: string }) => s.listing_id)];
  return [...new Set<string>(ids)];
}
const moderate = async (action: "hide" | "restore", note: string) =>
  call(listingMod.POST as never, await request(`/api/moderation/listings/${reported}`, { body: { action, note }, as: moderator }), { id: reported });

describe("hiding a listing and matching", () => {
  it("matches the nearest listing while it is active", async () => {
    expect(await matched()).toEqual([reported]);
  });

  it("leaves it out of POST /api/match once a moderator hides it, and matches the next one instead", async () => {
    const res = await moderate("hide", "Two reports of litter in the bags.");
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(res.json.listing.status).toBe("hidden");
    const ids = await matched();
    expect(ids).not.toContain(reported);
    expect(ids).toEqual([neighbour]);
  });

  it("matches it again once restored", async () => {
    expect((await moderate("restore", "The supplier sorted the bags.")).status).toBe(200);
    expect(await matched()).toEqual([reported]);
  });
});
