import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { ApiError } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { LIMITS, clientAddress, consume, ensureUnder } from "@/lib/security/rate-limit";

// next-auth's own routes, limited before next-auth sees them: password sign-in (failures
// per account and per client address; the failures are counted in authorize) and sign-in
// links (requests per e-mail and per client address). A refusal is a 429 with the error
// envelope and Retry-After, plus the `url` next-auth's browser client reads its error from.

async function emailOf(req: NextRequest): Promise<string> {
  const text = await req.clone().text();
  const type = req.headers.get("content-type") ?? "";
  try {
    const value = type.includes("json") ? (JSON.parse(text) as { email?: unknown }).email : new URLSearchParams(text).get("email");
    return typeof value === "string" ? value.trim().toLowerCase() : "";
  } catch {
    return "";
  }
}

/** A 429 for a password sign-in or a link request past its limit; null to let next-auth answer. */
export async function limitAuthRequest(req: NextRequest): Promise<Response | null> {
  const path = req.nextUrl.pathname;
  const password = path.endsWith("/callback/credentials");
  const link = path.endsWith("/signin/email");
  if (!password && !link) return null;
  const email = await emailOf(req);
  const address = clientAddress(req.headers);
  try {
    if (password) await ensureUnder([[LIMITS.signInAccount, email], [LIMITS.signInAddress, address]]);
    else await consume(email ? [[LIMITS.linkEmail, email], [LIMITS.linkAddress, address]] : [[LIMITS.linkAddress, address]]);
    return null;
  } catch (err) {
    if (!(err instanceof ApiError) || err.code !== "rate_limited") throw err;
    const retry = String(err.retryAfterS ?? 60);
    return NextResponse.json(
      { ...err.toEnvelope(), url: `${appUrl()}/sign-in?error=rate_limited&retry_after=${retry}` },
      { status: 429, headers: { "Retry-After": retry, "Cache-Control": "private, no-store" } },
    );
  }
}
