// Each side of a reservation can report the other from the reservation card: the link goes to
// the report form for the other person's account, never their own.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { createListing, createReservation } from "../factories";
import { listReservations } from "@/lib/services/reservations/list-reservations";

// The card's buttons are client components that ask for the app router, which only exists
// inside Next.js: a stand-in router lets the whole card render here.
vi.mock("next/navigation", () => ({
  useRouter: () => ({ refresh() {}, push() {}, replace() {}, back() {}, forward() {}, prefetch() {} }),
  usePathname: () => "/reservations",
  useSearchParams: () => new URLSearchParams(),
}));
const { ReservationCard } = await import("@/components/reservations/reservation-card");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let supplierId = "";
let gardenerId = "";

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  const listing = await createListing();
  supplierId = listing.owner_id;
  gardenerId = (await createReservation({ status: "confirmed", listing_id: listing.id })).gardener_id;
});
afterAll(() => ctx.close());

const reportHrefs = (html: string) => [...html.matchAll(/href="(\/report\?[^"]*)"[^>]*>Report this person/g)].map((m) => m[1].replace(/&amp;/g, "&"));

describe("Report this person on a reservation card", () => {
  it("links the gardener to a report on the supplier", async () => {
    const [view] = await listReservations(gardenerId, "gardener");
    const html = renderToStaticMarkup(createElement(ReservationCard, { v: view }));
    expect(reportHrefs(html)).toEqual([`/report?user=${supplierId}`]);
  });

  it("links the supplier to a report on the gardener", async () => {
    const [view] = await listReservations(supplierId, "supplier");
    const html = renderToStaticMarkup(createElement(ReservationCard, { v: view }));
    expect(reportHrefs(html)).toEqual([`/report?user=${gardenerId}`]);
    expect(html).toContain(`(${view.gardener.name})`);
  });
});
