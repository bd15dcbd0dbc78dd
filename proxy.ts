import { NextResponse, type NextRequest } from "next/server";
import { allowedMethods } from "@/lib/api/route-table";
import { ERROR_STATUS, type ErrorCode } from "@/lib/api/errors";
import { contentSecurityPolicy, newNonce, securityHeaders } from "@/lib/security/headers";
import { STATE_CHANGING, isCrossSite } from "@/lib/security/origin";
import { canonicalRedirect } from "@/lib/security/canonical";

// In front of every route: a page asked for on another host name than the public one is sent
// there first (lib/security/canonical.ts), the security headers and a fresh script nonce for
// each page, and, for the API, the checks that need no handler: cross-site writes (403), bodies over
// 1 MB (413, before anything reads them), unknown paths (404) and wrong methods (405 with
// Allow), each with the error envelope. next-auth's routes keep their own CSRF token and the
// Stripe webhook its signature, so neither is asked for an Origin.

export const MAX_BODY_BYTES = 1024 * 1024;

const OWN_PROTECTION = [/^\/api\/auth\//, /^\/api\/webhooks\//];

function envelope(code: ErrorCode, message: string, headers: Record<string, string> = {}): NextResponse {
  return NextResponse.json({ error: { code, message } }, { status: ERROR_STATUS[code], headers: { "Cache-Control": "private, no-store", ...headers } });
}

function apiRefusal(req: NextRequest): NextResponse | null {
  const { pathname } = req.nextUrl;
  const method = req.method.toUpperCase();
  const exempt = OWN_PROTECTION.some((re) => re.test(pathname));
  if (STATE_CHANGING.has(method) && !exempt && isCrossSite(req.headers)) {
    return envelope("forbidden", "This request came from another site, so it was refused.");
  }
  const length = Number(req.headers.get("content-length") ?? 0);
  if (length > MAX_BODY_BYTES) {
    return envelope("payload_too_large", `The request body is larger than ${MAX_BODY_BYTES / 1024 / 1024} MB.`);
  }
  if (pathname.startsWith("/api/auth/")) return null;
  const allowed = allowedMethods(pathname);
  if (!allowed) return envelope("not_found", "There is no API route at this address.");
  if (!allowed.includes(method)) {
    return envelope("method_not_allowed", `${method} is not allowed here; use ${allowed.filter((m) => m !== "OPTIONS" && m !== "HEAD").join(" or ")}.`, { Allow: allowed.join(", ") });
  }
  return null;
}

function withHeaders(res: NextResponse, policy: string): NextResponse {
  for (const [name, value] of Object.entries(securityHeaders())) res.headers.set(name, value);
  res.headers.set("Content-Security-Policy", policy);
  return res;
}

export function proxy(req: NextRequest): NextResponse {
  const nonce = newNonce();
  const policy = contentSecurityPolicy(nonce);
  const isApi = req.nextUrl.pathname === "/api" || req.nextUrl.pathname.startsWith("/api/");
  if (isApi) {
    const refusal = apiRefusal(req);
    if (refusal) return withHeaders(refusal, policy);
  } else {
    const canonical = canonicalRedirect(req.method, req.nextUrl.pathname + req.nextUrl.search, req.headers);
    // Temporary (307), so a browser never keeps a redirect that a later change of APP_URL would
    // turn into a loop.
    if (canonical) return withHeaders(NextResponse.redirect(canonical, 307), policy);
  }
  if (!isApi && STATE_CHANGING.has(req.method.toUpperCase()) && isCrossSite(req.headers)) {
    // Pages take no writes of their own (no server actions); refuse any from another site.
    return withHeaders(envelope("forbidden", "This request came from another site, so it was refused."), policy);
  }
  // Next.js reads the nonce from the request's policy and puts it on the scripts it renders.
  const requestHeaders = new Headers(req.headers);
  requestHeaders.set("Content-Security-Policy", policy);
  requestHeaders.set("x-nonce", nonce);
  return withHeaders(NextResponse.next({ request: { headers: requestHeaders } }), policy);
}

export const config = {
  // Next.js's own files (hashed build output, and next dev's live-reload socket) carry no page
  // and take no writes; everything else passes through here.
  matcher: ["/((?!_next/).*)"],
};
