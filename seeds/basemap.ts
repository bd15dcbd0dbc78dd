// Draws the demo base map of Fernhollow (an invented town) as GeoJSON: built-up area, river,
// roads, parks, woods and place names. Run `node --import tsx seeds/basemap.ts` to rewrite
// public/basemap/fernhollow.geojson; the output is committed and shipped with the app, so
// the map needs no tile server.
import fs from "node:fs";
import path from "node:path";
import { TOWN } from "./town";
import { prng } from "./ids";

type Pos = [number, number];
const { lat: LAT0, lng: LNG0 } = TOWN.centre;
const KM_LAT = 1 / 111.2;
const KM_LNG = 1 / (111.2 * Math.cos((LAT0 * Math.PI) / 180));
const at = (xKm: number, yKm: number): Pos => [round(LNG0 + xKm * KM_LNG), round(LAT0 + yKm * KM_LAT)];
const round = (x: number) => Math.round(x * 1e5) / 1e5;

function blob(cx: number, cy: number, r: number, seed: number, n = 18): Pos[] {
  const rand = prng(seed);
  const ring: Pos[] = [];
  for (let i = 0; i < n; i++) {
    const a = (i / n) * 2 * Math.PI;
    const rr = r * (0.75 + rand() * 0.45);
    ring.push(at(cx + rr * Math.cos(a), cy + rr * Math.sin(a)));
  }
  ring.push(ring[0]);
  return ring;
}

function wiggle(points: [number, number][], seed: number, amp = 0.25): Pos[] {
  const rand = prng(seed);
  const out: Pos[] = [];
  for (let i = 0; i < points.length - 1; i++) {
    const [x0, y0] = points[i];
    const [x1, y1] = points[i + 1];
    for (let s = 0; s < 4; s++) {
      const t = s / 4;
      out.push(at(x0 + (x1 - x0) * t + (rand() - 0.5) * amp, y0 + (y1 - y0) * t + (rand() - 0.5) * amp));
    }
  }
  out.push(at(...points[points.length - 1]));
  return out;
}

const feature = (kind: string, name: string | null, geometry: object) => ({ type: "Feature", properties: { kind, name }, geometry });

export function buildBasemap() {
  const features = [
    feature("land", null, { type: "Polygon", coordinates: [[at(-9, -9), at(9, -9), at(9, 9), at(-9, 9), at(-9, -9)]] }),
    feature("town", "Fernhollow", { type: "Polygon", coordinates: [blob(0, 0, 2.4, 11, 24)] }),
    feature("town", "Little Sedge", { type: "Polygon", coordinates: [blob(-4.8, 3.2, 0.8, 12)] }),
    feature("town", "Hartwell", { type: "Polygon", coordinates: [blob(4.6, -3.9, 0.7, 13)] }),
    feature("town", "Oakhurst Green", { type: "Polygon", coordinates: [blob(3.8, 4.4, 0.6, 14)] }),
    feature("wood", "Brackenholt Wood", { type: "Polygon", coordinates: [blob(-5.5, -4.5, 1.6, 15)] }),
    feature("wood", "Stonegrave Copse", { type: "Polygon", coordinates: [blob(6.2, 1.5, 1.0, 16)] }),
    feature("park", "Lantern Hill Park", { type: "Polygon", coordinates: [blob(-0.9, 0.8, 0.45, 17, 12)] }),
    feature("park", "Mill Meadows", { type: "Polygon", coordinates: [blob(1.2, -1.1, 0.5, 18, 12)] }),
    feature("water", "River Wend", { type: "LineString", coordinates: wiggle([[-9, -2.5], [-4, -1.2], [-1, -0.4], [1.5, -1.6], [5, -0.8], [9, 1.5]], 19, 0.35) }),
    feature("road", "Hollin Road", { type: "LineString", coordinates: wiggle([[-9, 0.5], [-2.4, 0.2], [0, 0], [2.4, 0.3], [9, -0.5]], 20, 0.1) }),
    feature("road", "Marsh Lane", { type: "LineString", coordinates: wiggle([[0, 0], [0.6, -3], [1.5, -9]], 21, 0.1) }),
    feature("road", "Cobble Row", { type: "LineString", coordinates: wiggle([[0, 0], [-0.8, 3], [-2.5, 9]], 22, 0.1) }),
    feature("road", "Saltbox Street", { type: "LineString", coordinates: wiggle([[-4.8, 3.2], [-2, 1.2], [0, 0], [2.5, 2.5], [3.8, 4.4]], 23, 0.1) }),
    feature("road", "Bellfounder Road", { type: "LineString", coordinates: wiggle([[0, 0], [2.6, -2.2], [4.6, -3.9], [9, -6]], 24, 0.1) }),
    feature("lane", "Tanner's Walk", { type: "LineString", coordinates: wiggle([[-1.5, -1.5], [-0.5, -0.6], [0.8, 0.8], [1.6, 1.8]], 25, 0.05) }),
    feature("lane", "Orchard Rise", { type: "LineString", coordinates: wiggle([[-1.8, 1.2], [-0.4, 1.5], [1.2, 1.1]], 26, 0.05) }),
    feature("lane", "Mill Leat Lane", { type: "LineString", coordinates: wiggle([[-1.2, -1.8], [0.4, -1.6], [1.9, -0.7]], 27, 0.05) }),
    ...[
      ["Fernhollow", 0, 0.3],
      ["Little Sedge", -4.8, 3.6],
      ["Hartwell", 4.6, -3.5],
      ["Oakhurst Green", 3.8, 4.8],
      ["Brackenholt Wood", -5.5, -4.5],
    ].map(([name, x, y]) => feature("label", name as string, { type: "Point", coordinates: at(x as number, y as number) })),
  ];
  return { type: "FeatureCollection", name: "Fernhollow demo base map (invented)", features };
}

if (process.argv[1]?.endsWith("basemap.ts")) {
  const out = path.join(__dirname, "..", "public", "basemap", "fernhollow.geojson");
  fs.writeFileSync(out, JSON.stringify(buildBasemap()) + "\n");
  console.log(`wrote ${out}`);
}
