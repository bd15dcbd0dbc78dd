// A local stand-in for a geocoding service that speaks Photon's open HTTP API, answering
// from the demo gazetteer (seeds/gazetteer.ts): the app's GEOCODER_URL points here in
// development and the end-to-end run, so the same client code runs as against a real
// Photon server. Tests start their own with startGeocoderFake({ port: 0 }).
//   GET /api?q=mill&limit=8[&lat=&lon=]  → GeoJSON FeatureCollection, best first
//   GET /reverse?lat=&lon=[&limit=1]     → the nearest place
import http from "node:http";
import type { AddressInfo } from "node:net";
import { gazetteerEntries, type GazetteerEntry } from "@/seeds/gazetteer";
import { comparePlaces, placeMatches } from "@/lib/geo/place-terms";
import { listenOn } from "../listen";

export interface GeocoderFake {
  port: number;
  url: string;
  /** Every request the fake answered, for tests: path and query. */
  requests: string[];
  close(): Promise<void>;
}

const PHOTON_TYPE: Record<GazetteerEntry["kind"], string> = { town: "city", village: "village", street: "street", postcode: "postcode", landmark: "locality" };

function feature(p: GazetteerEntry, i: number) {
  return {
    type: "Feature",
    geometry: { type: "Point", coordinates: [p.lng, p.lat] },
    properties: {
      osm_type: "N",
      osm_id: 900000 + i,
      name: p.name,
      type: PHOTON_TYPE[p.kind],
      ...(p.kind === "postcode" ? { postcode: p.name } : {}),
      ...(p.context ? { city: p.context } : {}),
      country: "Demo",
    },
  };
}

const collection = (features: unknown[]) => ({ type: "FeatureCollection", features });

export async function startGeocoderFake(opts: { port?: number; host?: string; entries?: GazetteerEntry[] } = {}): Promise<GeocoderFake> {
  const entries = opts.entries ?? gazetteerEntries();
  const indexed = entries.map((p, i) => ({ p, i }));
  const requests: string[] = [];
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://fake");
    requests.push(`${url.pathname}${url.search}`);
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" });
      res.end(JSON.stringify(body));
    };
    if (req.method !== "GET") return send(405, { message: "GET only" });
    const limit = Math.min(50, Math.max(1, Number(url.searchParams.get("limit") ?? 10) || 10));
    if (url.pathname === "/api" || url.pathname === "/api/") {
      const q = url.searchParams.get("q") ?? "";
      if (!q.trim()) return send(400, { message: "missing search term 'q': /?q=berlin" });
      const found = indexed.filter(({ p }) => placeMatches(p, q)).sort((a, b) => comparePlaces(q)(a.p, b.p));
      return send(200, collection(found.slice(0, limit).map(({ p, i }) => feature(p, i))));
    }
    if (url.pathname === "/reverse") {
      const lat = Number(url.searchParams.get("lat"));
      const lon = Number(url.searchParams.get("lon"));
      if (!Number.isFinite(lat) || !Number.isFinite(lon)) return send(400, { message: "missing lat/lon" });
      const near = [...indexed].sort((a, b) => (a.p.lat - lat) ** 2 + (a.p.lng - lon) ** 2 - ((b.p.lat - lat) ** 2 + (b.p.lng - lon) ** 2));
      return send(200, collection(near.slice(0, limit).map(({ p, i }) => feature(p, i))));
    }
    send(404, { message: "not found" });
  });
  const port = await listenOn(server, opts.port ?? 0, opts.host ?? "127.0.0.1");
  return {
    port,
    url: `http://${opts.host ?? "127.0.0.1"}:${port}`,
    requests,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
