import { appOrigins, type Env } from "@/lib/env";

// Cross-site request checks for state-changing requests. A browser names the page that sent
// a request in `Origin` (and, failing that, `Referer`); a request from another site is
// refused before it reaches a handler. Non-browser clients send neither and go on to the
// usual session checks — without a browser there is no victim's cookie to ride on.

export const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * The origins a request may come from: the configured public URL's (APP_URL, NEXTAUTH_URL),
 * and the origin the request itself was addressed to (its Host, with the scheme a proxy in
 * front reports). A cross-site request names its own site in Origin, which differs from the
 * Host it was sent to, so the second is only ever the app's own page on another of its names.
 */
export function ownOrigins(headers: Headers, env?: Env): Set<string> {
  const origins = new Set(appOrigins(env));
  const host = headers.get("host");
  const proto = headers.get("x-forwarded-proto")?.split(",")[0]?.trim() || "http";
  if (host && /^[A-Za-z0-9.:[\]-]+$/.test(host) && (proto === "http" || proto === "https")) origins.add(`${proto}://${host.toLowerCase()}`);
  return origins;
}

function originOfUrl(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/** True when a browser says this request came from a page of another site. */
export function isCrossSite(headers: Headers, env?: Env): boolean {
  const origin = headers.get("origin");
  const own = ownOrigins(headers, env);
  if (origin !== null) return !own.has(origin.trim().toLowerCase());
  const referer = headers.get("referer");
  if (referer !== null) {
    const from = originOfUrl(referer);
    return !from || !own.has(from);
  }
  return false;
}
