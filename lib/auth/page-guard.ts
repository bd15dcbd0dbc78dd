import "server-only";
import { forbidden, redirect } from "next/navigation";
import { currentUser, type SessionUser } from "./current-user";
import type { Role } from "./roles";

/** For signed-in pages: sends visitors to sign in (and back), and answers 403 for the wrong role. */
export async function pageUser(path: string, roles?: readonly Role[]): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(path)}`);
  if (roles && !roles.some((r) => user.roles.includes(r))) forbidden();
  return user;
}
