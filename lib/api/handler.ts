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
  if (err instanceof ApiError) return NextResponse.json(err.toEnvelope(), { status: err.status });
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

/** A public route: maps thrown errors to the envelope. */
export function handle<P = Params>(fn: (args: HandlerArgs<P>) => Promise<Response>) {
  return async (req: NextRequest, ctx?: Ctx): Promise<Response> => {
    try {
      const params = ((await ctx?.params) ?? {}) as P;
      return await fn({ req, params });
    } catch (err) {
      return toErrorResponse(err);
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

/** Read a JSON body; malformed JSON is a 400, not a 500. */
export async function readJson(req: Request): Promise<unknown> {
  const text = await req.text();
  if (!text.trim()) throw new ApiError("bad_request", "The request needs a JSON body.");
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The request body is not valid JSON.");
  }
}
