import { appUrl, readEnv, type Env } from "@/lib/env";

// One public address. A session cookie belongs to the host name the browser used, so a
// person who signed in on one name of the server (127.0.0.1) and comes back on another
// (localhost, from a bookmark or an old link) would look signed out, and a return from the
// payment page would land on a sign-in form. Pages are therefore only shown on the host of
// APP_URL (or NEXTAUTH_URL): any other host name is sent there first, path and query kept.
// The API is never redirected: webhooks, health checks and API clients call it by whatever
// name reaches the server, and a redirect would turn their POST into a GET.

const READS = new Set(["GET", "HEAD"]);

/** A Host header value without the port its scheme implies, in lower case. */
function normalHost(host: string, protocol: string): string {
  const h = host.trim().toLowerCase();
  if (protocol === "https:" && h.endsWith(":443")) return h.slice(0, -4);
  if (protocol === "http:" && h.endsWith(":80")) return h.slice(0, -3);
  return h;
}

/**
 * The host name a request was addressed to: what a proxy in front forwarded
 * (X-Forwarded-Host, its first value), else Host.
 */
export function requestHost(headers: Headers): string | null {
  const forwarded = headers.get("x-forwarded-host")?.split(",")[0]?.trim();
  const host = forwarded || headers.get("host")?.trim();
  return host && /^[A-Za-z0-9.:[\]-]+$/.test(host) ? host : null;
}

/**
 * Where to send a page request that arrived on another host name, or null to serve it.
 * `pathAndQuery` is the request's path with its query string.
 */
export function canonicalRedirect(method: string, pathAndQuery: string, headers: Headers, env?: Env): string | null {
  if (!READS.has(method.toUpperCase())) return null;
  if (pathAndQuery === "/api" || pathAndQuery.startsWith("/api/") || pathAndQuery.startsWith("/api?")) return null;
  if (readEnv(env).CANONICAL_HOST_REDIRECT === false) return null;
  const host = requestHost(headers);
  if (!host) return null;
  const canonical = new URL(appUrl(env));
  if (normalHost(host, canonical.protocol) === normalHost(canonical.host, canonical.protocol)) return null;
  const base = appUrl(env);
  return `${base}${pathAndQuery.startsWith("/") ? pathAndQuery : `/${pathAndQuery}`}`;
}
