import "server-only";
import { getToken } from "next-auth/jwt";
import { cookies, headers } from "next/headers";
import type { NextRequest } from "next/server";
import { ApiError } from "@/lib/api/errors";
import { findUserById, membershipsOf, rolesOf } from "@/db/users";
import { AUTH_SECRET } from "./config";
import { activeUserId } from "./sessions";
import type { Role } from "./roles";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  unit_system: "metric" | "imperial";
  roles: Role[];
  requested_roles: Role[];
  verified: boolean;
  /** The address was confirmed (the link in the e-mail sent on joining, or a sign-in link). */
  email_verified: boolean;
  organisation: { id: string; name: string; kind: string; org_role: "owner" | "staff" } | null;
  /** Where they plan from when a bed has no place of its own (their own eyes only). */
  home: { label: string; lat: number; lng: number } | null;
}

/** The person behind a session, read fresh from the database so role changes and suspensions apply at once. */
export async function loadSessionUser(id: string): Promise<SessionUser | null> {
  const user = await findUserById(id);
  if (!user) return null;
  if (user.suspended_at) throw new ApiError("suspended", "This account is suspended. Contact the Duffbank team.");
  const [roles, memberships] = await Promise.all([rolesOf(id), membershipsOf(id)]);
  const org = memberships[0];
  return {
    id: user.id,
    email: user.email,
    name: user.display_name,
    unit_system: user.unit_system,
    roles: roles.filter((r) => r.status === "active").map((r) => r.role),
    requested_roles: roles.filter((r) => r.status === "requested").map((r) => r.role),
    verified: Boolean(user.verified_at),
    email_verified: Boolean(user.email_verified_at),
    organisation: org ? { id: org.organisation_id, name: org.name, kind: org.kind, org_role: org.org_role } : null,
    home: user.home_place && user.home_lat !== null && user.home_lng !== null ? { label: user.home_place, lat: Number(user.home_lat), lng: Number(user.home_lng) } : null,
  };
}

function checkRoles(user: SessionUser, roles?: readonly Role[]) {
  if (roles && roles.length && !roles.some((r) => user.roles.includes(r))) {
    throw new ApiError("forbidden", "Your account does not have access to this.");
  }
  return user;
}

/**
 * The person behind a session cookie: its token must decode, and the session it names must
 * still be going (not signed out, not ended by a password change, "sign out everywhere" or a
 * suspension). The session row is read alongside the user row, on every request.
 */
async function userOfCookie(req: Parameters<typeof getToken>[0]["req"]): Promise<SessionUser | null> {
  const token = await getToken({ req, secret: AUTH_SECRET });
  const id = typeof token?.uid === "string" ? token.uid : null;
  if (!id) return null;
  const [active, user] = await Promise.allSettled([activeUserId(token), loadSessionUser(id)]);
  if (active.status === "rejected") throw active.reason;
  if (active.value !== id) return null;
  if (user.status === "rejected") throw user.reason;
  return user.value;
}

/** Route handlers: the session cookie on the request. */
export async function requireUser(req: NextRequest, roles?: readonly Role[]): Promise<SessionUser> {
  const user = await userOfCookie(req);
  if (!user) throw new ApiError("unauthenticated", "Sign in to do this.");
  return checkRoles(user, roles);
}

/** Suspended people count as signed out where signing in is optional. */
async function unlessSuspended(find: Promise<SessionUser | null>): Promise<SessionUser | null> {
  try {
    return await find;
  } catch (err) {
    if (err instanceof ApiError && err.code === "suspended") return null;
    throw err;
  }
}

/** Public route handlers that show more to some people: the signed-in person, or null. */
export async function optionalRequestUser(req: NextRequest): Promise<SessionUser | null> {
  return unlessSuspended(userOfCookie(req));
}

/** Pages and server actions: null when nobody is signed in. */
export async function currentUser(): Promise<SessionUser | null> {
  return unlessSuspended(userOfCookie({ headers: await headers(), cookies: await cookies() } as never));
}

/** Server actions: the same 401/403 rules as route handlers. */
export async function requireCurrentUser(roles?: readonly Role[]): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new ApiError("unauthenticated", "Sign in to do this.");
  return checkRoles(user, roles);
}

/** Reserving and posting need a confirmed address (403 with a way forward otherwise). */
export function requireVerifiedEmail(user: SessionUser): SessionUser {
  if (!user.email_verified) {
    throw new ApiError("forbidden", "Confirm your e-mail address first: follow the link in the e-mail we sent when you joined, or ask for a sign-in link by e-mail.");
  }
  return user;
}

export function hasRole(user: SessionUser | null, ...roles: Role[]): boolean {
  return !!user && roles.some((r) => user.roles.includes(r));
}
