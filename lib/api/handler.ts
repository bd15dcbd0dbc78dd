import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { ZodError } from "zod";
import { ApiError, fromZod } from "./errors";
import { requireUser, type SessionUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";

type Params = Record<string, string | string[]>;
type Ctx = { params: Promise<Params> };

export interface HandlerArgs<P> {
  req: NextRequest;
  params: P;
}

export function toErrorResponse(err: unknown): NextResponse {
  if (err instanceof ApiError) {
    const headers = err.retryAfterS ? { "Retry-After": String(err.retryAfterS) } : undefined;
    return NextResponse.json(err.toEnvelope(), { status: err.status, headers });
  }
  if (err instanceof ZodError) {
    const api = fromZod(err);
    return NextResponse.json(api.toEnvelope(), { status: api.status });
  }
  console.error("[api] unexpected error", err);
  return NextResponse.json(
    { error: { code: "internal", message: "Something went wrong on our side. Please try again." } },
    { status: 500 },
  );
}

// API answers are about someone (their reservations, their address) or vary by who asks,
// so no shared cache keeps them unless a handler says otherwise.
function privateByDefault(res: Response): Response {
  if (!res.headers.has("cache-control")) res.headers.set("Cache-Control", "private, no-store");
  return res;
}

/** A public route: maps thrown errors to the envelope. */
export function handle<P = Params>(fn: (args: HandlerArgs<P>) => Promise<Response>) {
  return async (req: NextRequest, ctx?: Ctx): Promise<Response> => {
    try {
      const params = ((await ctx?.params) ?? {}) as P;
      return privateByDefault(await fn({ req, params }));
    } catch (err) {
      return privateByDefault(toErrorResponse(err));
    }
  };
}

/** A signed-in route: 401 without a session, 403 without one of `roles` (any role when omitted). */
export function withAuth<P = Params>(
  fn: (args: HandlerArgs<P> & { user: SessionUser }) => Promise<Response>,
  roles?: readonly Role[],
) {
  return handle<P>(async ({ req, params }) => {
    const user = await requireUser(req, roles);
    return fn({ req, params, user });
  });
}

/** Bodies larger than this are refused (413) before they are parsed; proxy.ts checks Content-Length, this the bytes. */
export const MAX_JSON_BYTES = 1024 * 1024;

const JSON_TYPE = /^application\/(?:[\w.+-]+\+)?json\s*(?:;|$)/i;

/** The body as text, stopping with a 413 as soon as it passes `limit` bytes. */
export async function readText(req: Request, limit: number = MAX_JSON_BYTES): Promise<string> {
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw new ApiError("payload_too_large", `The request body is larger than ${limit / 1024 / 1024} MB.`);
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

/**
 * Read a JSON body: 415 unless it is sent as JSON (a cross-site form can only send text/plain
 * or form encodings), 413 past 1 MB, 400 for malformed JSON, never a 500.
 */
export async function readJson(req: Request): Promise<unknown> {
  return parseBody(req, false);
}

/** The same for a route whose body may be left out: no body reads as `{}`. */
export async function readOptionalJson(req: Request): Promise<unknown> {
  return parseBody(req, true);
}

async function parseBody(req: Request, optional: boolean): Promise<unknown> {
  const isJson = JSON_TYPE.test(req.headers.get("content-type") ?? "");
  const text = await readText(req, MAX_JSON_BYTES);
  if (!text.trim()) {
    if (optional) return {};
    throw new ApiError("bad_request", "The request needs a JSON body.");
  }
  if (!isJson) throw new ApiError("unsupported_media_type", "Send the body as JSON, with Content-Type: application/json.");
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The request body is not valid JSON.");
  }
}
