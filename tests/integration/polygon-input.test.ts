// An empty or malformed outline is a 422 with a message on the field, never a 500, on every
// route that takes one (POST /api/estimate, POST /api/beds, PATCH /api/beds/:id, POST /api/match).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser } from "../factories";
import { POST as estimate } from "@/app/api/estimate/route";
import { POST as createBed } from "@/app/api/beds/route";
import { PATCH as updateBed } from "@/app/api/beds/[id]/route";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let gardener: { id: string };
let bedId: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  gardener = await createUser({ roles: ["gardener"] });
  const made = await call(createBed as never, await request("/api/beds", { body: { name: "Test bed", bed: { length_m: 2, width_m: 1 } }, as: gardener.id }));
  expect(made.status).toBe(201);
  bedId = made.json.bed.id;
});
afterAll(async () => ctx.close());

const ring = (pts: unknown[][]) => [...pts, pts[0]];
const square = ring([[0.85, 52.2], [0.85001, 52.2], [0.85001, 52.20001], [0.85, 52.20001]]);

const polygons: [string, unknown][] = [
  ["an empty object", {}],
  ["no coordinates", { type: "Polygon" }],
  ["empty coordinates", { type: "Polygon", coordinates: [] }],
  ["an empty ring", { type: "Polygon", coordinates: [[]] }],
  ["a ring of one point", { type: "Polygon", coordinates: [[[0.85, 52.2]]] }],
  ["a ring of two points", { type: "Polygon", coordinates: [[[0.85, 52.2], [0.851, 52.2]]] }],
  ["an open ring", { type: "Polygon", coordinates: [[[0.85, 52.2], [0.851, 52.2], [0.851, 52.201]]] }],
  ["all points the same", { type: "Polygon", coordinates: [ring([[0.85, 52.2], [0.85, 52.2], [0.85, 52.2]])] }],
  ["points on a line", { type: "Polygon", coordinates: [ring([[0.85, 52.2], [0.851, 52.2], [0.852, 52.2]])] }],
  ["a bow tie (self-crossing)", { type: "Polygon", coordinates: [ring([[0.85, 52.2], [0.851, 52.201], [0.851, 52.2], [0.85, 52.201]])] }],
  ["strings for numbers", { type: "Polygon", coordinates: [ring([["0.85", "52.2"], ["0.851", "52.2"], ["0.851", "52.201"]])] }],
  ["NaN-like values", { type: "Polygon", coordinates: [[[null, null], [null, null], [null, null], [null, null]]] }],
  ["a latitude past 90", { type: "Polygon", coordinates: [ring([[0.85, 95], [0.851, 95], [0.851, 95.001]])] }],
  ["a longitude past 180", { type: "Polygon", coordinates: [ring([[190, 52.2], [190.001, 52.2], [190.001, 52.201]])] }],
  ["three numbers in a position", { type: "Polygon", coordinates: [ring([[0.85, 52.2, 1, 2], [0.851, 52.2], [0.851, 52.201]])] }],
  ["a position that is not an array", { type: "Polygon", coordinates: [["a", "b", "c", "d"]] }],
  ["rings that are not arrays", { type: "Polygon", coordinates: "0.85,52.2" }],
  ["a MultiPolygon", { type: "MultiPolygon", coordinates: [[square]] }],
  ["a Feature wrapped round it", { type: "Feature", geometry: { type: "Polygon", coordinates: [square] } }],
  ["a hole bigger than its outline", { type: "Polygon", coordinates: [square, ring([[0.8, 52.1], [0.9, 52.1], [0.9, 52.3], [0.8, 52.3]])] }],
  ["a string", "POLYGON((0 0,1 0,1 1,0 0))"],
  ["null", null],
  ["a number", 7],
];

const send = (handler: unknown, url: string, method: string, params: Record<string, string> = {}) => async (body: unknown) =>
  call(handler as never, await request(url, { method, body, as: gardener.id }), params);

describe.each([
  ["POST /api/estimate", (p: unknown) => send(estimate, "/api/estimate", "POST")({ bed: { polygon: p } })],
  ["POST /api/beds", (p: unknown) => send(createBed, "/api/beds", "POST")({ name: "Outline bed", bed: { polygon: p } })],
  ["PATCH /api/beds/:id", (p: unknown) => send(updateBed, `/api/beds/${bedId}`, "PATCH", { id: bedId })({ bed: { polygon: p } })],
] as const)("%s", (_route, post) => {
  it.each(polygons)("answers 422 with a field message for %s", async (_name, polygon) => {
    const res = await post(polygon);
    expect(res.status, JSON.stringify(res.json)).toBe(422);
    expect(res.json.error.code).toBe("invalid_input");
    const keys = Object.keys(res.json.error.fields ?? {});
    expect(keys.length).toBeGreaterThan(0);
    expect(keys.some((k) => k.startsWith("bed"))).toBe(true);
  });

  it("still takes a good outline", async () => {
    const res = await post({ type: "Polygon", coordinates: [ring([[0.85, 52.2], [0.85003, 52.2], [0.85003, 52.20002], [0.85, 52.20002]])] });
    expect([200, 201]).toContain(res.status);
  });
});
