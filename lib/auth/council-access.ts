import "server-only";
import { ApiError } from "@/lib/api/errors";
import type { SessionUser } from "@/lib/auth/current-user";

export interface CouncilStaff {
  userId: string;
  organisationId: string;
  organisationName: string;
  isOwner: boolean;
}

/** The council a staff member acts for; anyone else is refused before any row is read. */
export function councilOf(user: SessionUser): CouncilStaff {
  if (!user.roles.includes("council")) throw new ApiError("forbidden", "Only council staff can do this.");
  const org = user.organisation;
  if (!org || org.kind !== "council") throw new ApiError("forbidden", "Your account is not part of a council.");
  return { userId: user.id, organisationId: org.id, organisationName: org.name, isOwner: org.org_role === "owner" };
}

/** Owners manage who is on the staff. */
export function councilOwnerOf(user: SessionUser): CouncilStaff {
  const ctx = councilOf(user);
  if (!ctx.isOwner) throw new ApiError("forbidden", "Only the account owner of your council can change its staff.");
  return ctx;
}
