"use client";
import { getCsrfToken } from "next-auth/react";

// Posts to next-auth's own sign-in routes the way its signIn() helper does (form-encoded,
// with its CSRF token and json=true), but keeps what signIn() drops: the 429 envelope's
// message, which says when to try again.

export type AuthOutcome = { ok: true; url: string } | { ok: false; error: string; message?: string };

export async function authPost(path: "callback/credentials" | "signin/email", fields: Record<string, string>): Promise<AuthOutcome> {
  let res: Response;
  try {
    const csrfToken = (await getCsrfToken()) ?? "";
    res = await fetch(`/api/auth/${path}`, {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ ...fields, csrfToken, json: "true" }),
      credentials: "same-origin",
    });
  } catch {
    return { ok: false, error: "network", message: "We could not reach Duffbank. Check your connection and try again." };
  }
  const data = (await res.json().catch(() => ({}))) as { url?: string; error?: { code?: string; message?: string } };
  if (res.status === 429) return { ok: false, error: "rate_limited", message: data.error?.message };
  const error = data.url ? new URL(data.url, window.location.origin).searchParams.get("error") : "unknown";
  if (!res.ok || error) return { ok: false, error: error ?? "unknown" };
  return { ok: true, url: data.url! };
}
