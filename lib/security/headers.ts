import { appUrl, browserHosts, readEnv, type Env } from "@/lib/env";

// The response headers every page and API answer carries (set in proxy.ts). Scripts run only
// with this request's nonce (Next.js puts it on its own inline and bundle scripts) or when a
// nonced script loaded them ('strict-dynamic'); no 'unsafe-eval' outside `next dev`, whose
// React debugging needs it. Styles allow inline style attributes: React and Leaflet write
// them, and CSS cannot run script.

/** A fresh, unguessable nonce for one response. */
export function newNonce(): string {
  const bytes = new Uint8Array(18);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

export function contentSecurityPolicy(nonce: string, env?: Env): string {
  const dev = readEnv(env).NODE_ENV === "development";
  const hosts = browserHosts(env);
  const https = appUrl(env).startsWith("https:");
  const directives: [string, ...string[]][] = [
    ["default-src", "'self'"],
    ["script-src", "'self'", `'nonce-${nonce}'`, "'strict-dynamic'", ...(dev ? ["'unsafe-eval'"] : [])],
    ["style-src", "'self'", "'unsafe-inline'"],
    ["img-src", "'self'", "data:", "blob:", ...hosts.images],
    ["font-src", "'self'"],
    ["connect-src", "'self'", ...hosts.connect],
    ["worker-src", "'self'", "blob:"],
    ["manifest-src", "'self'"],
    ["media-src", "'self'"],
    ["frame-src", "'none'"],
    ["object-src", "'none'"],
    ["base-uri", "'self'"],
    ["form-action", "'self'"],
    ["frame-ancestors", "'none'"],
  ];
  if (https) directives.push(["upgrade-insecure-requests"]);
  return directives.map((d) => d.join(" ")).join("; ");
}

// Two years, as browsers' preload lists ask (hstspreload.org, from memory).
const HSTS = "max-age=63072000; includeSubDomains";

/** Everything but the policy: the same for every response. */
export function securityHeaders(env?: Env): Record<string, string> {
  const headers: Record<string, string> = {
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": "strict-origin-when-cross-origin",
    "X-Frame-Options": "DENY",
    // Geolocation for the app's own pages ("use my location"); nothing else is asked for.
    "Permissions-Policy": "geolocation=(self), camera=(), microphone=(), payment=(), usb=(), browsing-topics=()",
    "Cross-Origin-Opener-Policy": "same-origin",
  };
  if (appUrl(env).startsWith("https:")) headers["Strict-Transport-Security"] = HSTS;
  return headers;
}
