import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { profileSchema } from "@/lib/validation/auth";
import { updateProfile } from "@/lib/services/accounts/update-profile";
import { loadSessionUser } from "@/lib/auth/current-user";

// GET /api/me — the signed-in person, with roles and organisation.
export const GET = withAuth(async ({ user }) => NextResponse.json({ user }));

// PATCH /api/me — name, unit system, reminder opt-out, and roles asked for.
export const PATCH = withAuth(async ({ req, user }) => {
  const input = parseInput(profileSchema, await readJson(req));
  await updateProfile(user.id, input);
  return NextResponse.json({ user: await loadSessionUser(user.id) });
});
