import { z } from "zod";
import { ERROR_STATUS } from "./errors";
import { API_ROUTES, type RouteDoc } from "./routes";

// Builds the OpenAPI 3.1 document from the route list, converting each shared zod schema
// with zod's own JSON Schema output (draft 2020-12, which OpenAPI 3.1 uses).

const errorEnvelope = {
  type: "object",
  required: ["error"],
  properties: {
    error: {
      type: "object",
      required: ["code", "message"],
      properties: {
        code: { type: "string", enum: Object.keys(ERROR_STATUS) },
        message: { type: "string" },
        fields: { type: "object", additionalProperties: { type: "string" } },
      },
    },
  },
};

function jsonSchema(schema: z.ZodType) {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, { io: "input", unrepresentable: "any" }) as Record<string, unknown>;
  return rest;
}

const idempotencyKeyHeader = {
  name: "Idempotency-Key",
  in: "header",
  required: false,
  schema: { type: "string", minLength: 1, maxLength: 255 },
  description:
    "A fresh random value (a UUID) per request. The same key from the same person within 24 hours returns the first answer (header Idempotent-Replayed: true) and changes nothing again; the same key with a different request is a 409 idempotency_mismatch.",
};

function parameters(route: RouteDoc) {
  const doc = route.query ? (jsonSchema(route.query) as { properties?: Record<string, Record<string, unknown>>; required?: string[] }) : {};
  const query = Object.entries(doc.properties ?? {}).map(([name, { description, ...schema }]) => ({
    name,
    in: "query",
    required: (doc.required ?? []).includes(name),
    ...(description ? { description } : {}),
    schema,
  }));
  return route.idempotent ? [...query, idempotencyKeyHeader] : query;
}

function operation(route: RouteDoc) {
  const responses: Record<string, unknown> = {
    [String(route.status ?? 200)]: { description: route.responseDescription ?? "OK", ...(route.response ? { content: { "application/json": { schema: jsonSchema(route.response) } } } : {}) },
  };
  for (const code of route.errors ?? []) responses[String(code)] = { $ref: `#/components/responses/Error${code}` };
  return {
    summary: route.summary,
    tags: [route.tag],
    ...(route.auth !== "public" ? { security: [{ session: [] }], "x-roles": route.auth === "signed-in" ? [] : route.auth } : { security: [] }),
    ...(route.query || route.idempotent ? { parameters: parameters(route) } : {}),
    ...(route.body ? { requestBody: { required: true, content: { "application/json": { schema: jsonSchema(route.body) } } } } : {}),
    responses,
  };
}

export function openApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const route of API_ROUTES) {
    paths[route.path] ??= {};
    paths[route.path][route.method] = operation(route);
  }
  const statuses = [...new Set(Object.values(ERROR_STATUS))];
  return {
    openapi: "3.1.0",
    info: { title: "Duffbank API", version: "0.1.0", description: "Plan no-dig beds, and list, find and reserve the material they need." },
    servers: [{ url: "/" }],
    paths,
    components: {
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "next-auth.session-token" } },
      schemas: { Error: errorEnvelope },
      responses: Object.fromEntries(
        statuses.map((s) => [`Error${s}`, { description: `Error (${s})`, content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } }]),
      ),
    },
  };
}
