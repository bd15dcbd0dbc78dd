import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { signUpload } from "@/lib/media/cloudinary";

// POST /api/media/sign — a signature for one browser upload of a listing photo, into the
// signed-in person's own folder; the browser then posts the file straight to the image service.
export const POST = withAuth(async ({ user }) => NextResponse.json(signUpload(user.id)), LISTING_ROLES);
