import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import { AUTH_SECRET } from "@/lib/auth/config";
import { startSession } from "@/lib/auth/sessions";

/** A session cookie exactly as next-auth would set it at sign-in: a new server-side session, named in the token. */
export async function sessionCookie(uid: string, sid?: string): Promise<string> {
  const session = sid ?? (await startSession(uid));
  const token = await encode({ token: { uid, sub: uid, sid: session }, secret: AUTH_SECRET });
  return `next-auth.session-token=${token}`;
}

export async function request(
  url: string,
  opts: { method?: string; body?: unknown; rawBody?: string; as?: string | null; headers?: Record<string, string> } = {},
): Promise<NextRequest> {
  const headers: Record<string, string> = { ...(opts.headers ?? {}) };
  if (opts.as) headers.cookie = await sessionCookie(opts.as);
  let body: string | undefined;
  if (opts.rawBody !== undefined) body = opts.rawBody;
  else if (opts.body !== undefined) body = JSON.stringify(opts.body);
  if (body !== undefined) headers["content-type"] ??= "application/json";
  return new NextRequest(new URL(url, "http://localhost:3000"), { method: opts.method ?? (body ? "POST" : "GET"), headers, body });
}

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Call a route handler as Next.js would, returning status and parsed JSON. */
export async function call(handler: Handler, req: NextRequest, params: Record<string, string> = {}) {
  const res = await handler(req, { params: Promise.resolve(params) });
  const text = await res.text();
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  return { status: res.status, json };
}
