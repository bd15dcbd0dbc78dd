import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/api/openapi";
import { API_ROUTES } from "@/lib/api/routes";

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? routeFiles(p) : e.name === "route.ts" ? [p] : [];
  });
}

const documentNow = () => openApiDocument() as any;

describe("GET /api/openapi.json", () => {
  const doc = openApiDocument() as any;

  it("is OpenAPI 3.1 and documents every route handler in app/api", () => {
    expect(doc.openapi).toBe("3.1.0");
    const root = path.resolve(__dirname, "../../app/api");
    for (const file of routeFiles(root)) {
      const rel = path.relative(root, path.dirname(file)).split(path.sep).join("/");
      if (rel.startsWith("auth/") || rel.startsWith("webhooks/")) continue; // next-auth's own, and provider callbacks
      const apiPath = `/api/${rel}`.replace(/\[(\w+)\]/g, "{$1}");
      const src = fs.readFileSync(file, "utf8");
      const methods = [...src.matchAll(/export (?:const|async function|function) (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => m[1].toLowerCase());
      for (const m of methods) expect(doc.paths[apiPath]?.[m], `${m.toUpperCase()} ${apiPath}`).toHaveProperty("responses");
    }
  });

  // proxy.ts answers 404 and 405 from this list (lib/api/route-table.ts), so it must name
  // exactly the methods the route files export, no more.
  it("lists no method that a route file does not export", () => {
    const root = path.resolve(__dirname, "../..");
    for (const route of API_ROUTES) {
      const file = path.join(root, "app", route.path.replace(/\{(\w+)\}/g, "[$1]"), "route.ts");
      expect(fs.existsSync(file), `${route.path} has no route file`).toBe(true);
      const src = fs.readFileSync(file, "utf8");
      expect(src, `${route.method.toUpperCase()} ${route.path}`).toMatch(new RegExp(`export (?:const|async function|function) ${route.method.toUpperCase()}\\b|as ${route.method.toUpperCase()}\\b`));
    }
  });

  it("carries the request schema of the sign-up route from zod", () => {
    const schema = doc.paths["/api/users"].post.requestBody.content["application/json"].schema;
    expect(schema.required).toEqual(expect.arrayContaining(["email", "display_name", "password"]));
    expect(schema.properties.password.minLength).toBe(10);
  });
});

describe("POST /api/estimate in the document", () => {
  const op = documentNow().paths["/api/estimate"].post;
  it("describes the new answer fields beside the old ones", () => {
    const props = op.responses["200"].content["application/json"].schema.properties;
    for (const key of ["area_m2", "needs", "water_l", "water_us_gal", "blend", "timeline", "cautions", "water_range_l", "water_depth_mm", "planting", "settling", "top_ups", "costs"]) {
      expect(props[key], key).toHaveProperty("type", expect.stringMatching(/^(number|string|array|object)$/));
    }
    expect(props.water_range_l.prefixItems).toHaveLength(2);
    expect(props.planting.properties).toHaveProperty("plant_into_from");
    expect(props.costs.properties.totals.items.properties).toHaveProperty("deposits_cents");
  });
  it("takes measurements in either unit system, and a plan or a match to price", () => {
    const body = op.requestBody.content["application/json"].schema;
    expect(body.properties).toHaveProperty("plan");
    expect(body.properties).toHaveProperty("match");
    expect(body.properties).toHaveProperty("units");
    expect(JSON.stringify(body)).toContain("depth_in");
  });
  it("matches a real answer", async () => {
    const { estimateResponseSchema } = await import("@/lib/validation/estimate-response");
    const { estimate } = await import("@/lib/calc/estimate");
    const answer = JSON.parse(JSON.stringify(estimate({ bed: { length_m: 3, width_m: 1.2 }, start_date: "2027-03-01" })));
    const parsed = estimateResponseSchema.strict().safeParse(answer);
    expect(parsed.success ? [] : parsed.error.issues).toEqual([]);
  });
});

describe("the OpenAPI document", () => {
  it("validates as OpenAPI 3.1 with a standard parser", async () => {
    const { default: SwaggerParser } = await import("@apidevtools/swagger-parser");
    const doc = structuredClone(openApiDocument());
    await expect(SwaggerParser.validate(doc as never)).resolves.toMatchObject({ openapi: expect.stringMatching(/^3\.1\./) });
  });
});

describe("the open needs in the document", () => {
  const doc = documentNow();
  it("has every route of the contract, with bad input as a documented 422", () => {
    for (const [path, method] of [["/api/needs", "get"], ["/api/needs", "post"], ["/api/needs/{id}", "patch"], ["/api/needs/{id}", "delete"], ["/api/needs/nearby-demand", "get"]]) {
      expect(doc.paths[path]?.[method], `${method.toUpperCase()} ${path}`).toHaveProperty("responses");
    }
    expect(doc.paths["/api/needs"].post.responses).toHaveProperty("422");
    expect(doc.paths["/api/needs/{id}"].patch.responses).toHaveProperty("422");
    const body = doc.paths["/api/needs"].post.requestBody.content["application/json"].schema;
    expect(body.properties.radius_km.maximum).toBe(50);
    expect(body.properties.quantity.exclusiveMinimum).toBe(0);
  });
  it("marks lat, lng and material as required for the nearby demand", () => {
    const params = doc.paths["/api/needs/nearby-demand"].get.parameters as { name: string; required: boolean; description?: string }[];
    expect(params.map((p) => [p.name, p.required])).toEqual([["lat", true], ["lng", true], ["material", true]]);
    expect(params.every((p) => p.description)).toBe(true);
  });
});
