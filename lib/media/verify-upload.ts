import "server-only";
import { ApiError } from "@/lib/api/errors";
import type { UploadedPhoto } from "@/lib/validation/listings";
import { uploadFolder, verifyUploadResult } from "./cloudinary";

/**
 * Accepts upload results only when Cloudinary signed them (public_id and version, with our
 * API secret) and they sit in the person's own folder — which their signed upload request
 * fixed — so nobody can attach an image they did not upload through us.
 */
export function checkUploadedPhotos(userId: string, photos: UploadedPhoto[], field = "photos"): void {
  const fields: Record<string, string> = {};
  const folder = `${uploadFolder(userId)}/`;
  photos.forEach((p, i) => {
    if (!p.public_id.startsWith(folder) || p.public_id.includes("..")) {
      fields[`${field}.${i}`] = "This photo was not uploaded from your account. Upload it again here.";
    } else if (!verifyUploadResult(p.public_id, p.version, p.signature)) {
      fields[`${field}.${i}`] = "This photo's upload could not be verified (its signature does not match). Upload it again.";
    }
  });
  if (Object.keys(fields).length) throw new ApiError("invalid_input", "Some photos could not be verified.", fields);
}
