import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/api/openapi";

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? routeFiles(p) : e.name === "route.ts" ? [p] : [];
  });
}

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
      for (const m of methods) expect(doc.paths[apiPath]?.[m], `${m.toUpperCase()} ${apiPath}`).toBeTruthy();
    }
  });

  it("carries the request schema of the sign-up route from zod", () => {
    const schema = doc.paths["/api/users"].post.requestBody.content["application/json"].schema;
    expect(schema.required).toEqual(expect.arrayContaining(["email", "display_name", "password"]));
    expect(schema.properties.password.minLength).toBe(10);
  });
});

describe("the OpenAPI document", () => {
  it("validates as OpenAPI 3.1 with a standard parser", async () => {
    const { default: SwaggerParser } = await import("@apidevtools/swagger-parser");
    const doc = structuredClone(openApiDocument());
    await expect(SwaggerParser.validate(doc as never)).resolves.toBeTruthy();
  });
});
