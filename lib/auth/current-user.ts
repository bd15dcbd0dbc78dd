import "server-only";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import type { NextRequest } from "next/server";
import { ApiError } from "@/lib/api/errors";
import { findUserById, membershipsOf, rolesOf } from "@/db/users";
import { AUTH_SECRET } from "./config";
import { authOptions } from "./options";
import type { Role } from "./roles";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  unit_system: "metric" | "imperial";
  roles: Role[];
  requested_roles: Role[];
  verified: boolean;
  organisation: { id: string; name: string; kind: string; org_role: "owner" | "staff" } | null;
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
    organisation: org ? { id: org.organisation_id, name: org.name, kind: org.kind, org_role: org.org_role } : null,
  };
}

function checkRoles(user: SessionUser, roles?: readonly Role[]) {
  if (roles && roles.length && !roles.some((r) => user.roles.includes(r))) {
    throw new ApiError("forbidden", "Your account does not have access to this.");
  }
  return user;
}

/** Route handlers: the session cookie on the request. */
export async function requireUser(req: NextRequest, roles?: readonly Role[]): Promise<SessionUser> {
  const token = await getToken({ req, secret: AUTH_SECRET });
  const id = typeof token?.uid === "string" ? token.uid : null;
  const user = id ? await loadSessionUser(id) : null;
  if (!user) throw new ApiError("unauthenticated", "Sign in to do this.");
  return checkRoles(user, roles);
}

/** The person behind an id from a session, or null when there is none or they are suspended. */
async function activeUserOrNull(id: string | null | undefined): Promise<SessionUser | null> {
  if (!id) return null;
  try {
    return await loadSessionUser(id);
  } catch (err) {
    if (err instanceof ApiError && err.code === "suspended") return null;
    throw err;
  }
}

/** Public route handlers that show more to some people: the signed-in person, or null. */
export async function optionalRequestUser(req: NextRequest): Promise<SessionUser | null> {
  const token = await getToken({ req, secret: AUTH_SECRET });
  return activeUserOrNull(typeof token?.uid === "string" ? token.uid : null);
}

/** Pages and server actions: null when nobody is signed in. */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  return activeUserOrNull(session?.user?.id);
}

/** Server actions: the same 401/403 rules as route handlers. */
export async function requireCurrentUser(roles?: readonly Role[]): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new ApiError("unauthenticated", "Sign in to do this.");
  return checkRoles(user, roles);
}

export function hasRole(user: SessionUser | null, ...roles: Role[]): boolean {
  return !!user && roles.some((r) => user.roles.includes(r));
}
