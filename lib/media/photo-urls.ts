import "server-only";
import { getCldImageUrl } from "next-cloudinary";
import { cloudinarySettings } from "./cloudinary";

// Delivery URLs are built here, on the server, with next-cloudinary's URL helper and the
// host from CLOUDINARY_URL. NEXT_PUBLIC_* values are fixed when the app is built, so a
// browser-side helper could not follow a fake that starts on a different port each run.

export interface PhotoVariant {
  url: string;
  width: number;
  height: number;
}

export interface StoredPhoto {
  public_id: string;
  width: number;
  height: number;
}

/** The sizes the app shows: cards and thumbnails are cropped to fill, the large view fits inside. */
export const PHOTO_SIZES = {
  card: { width: 480, height: 360, crop: "fill" },
  thumb: { width: 160, height: 120, crop: "fill" },
  large: { width: 1200, height: 1200, crop: "limit" },
} as const;

export type PhotoSize = keyof typeof PHOTO_SIZES;

/** What c_limit delivers: the original scaled down (never up) to fit inside the box. */
function limitedSize(photo: StoredPhoto, box: { width: number; height: number }) {
  const scale = Math.min(1, box.width / photo.width, box.height / photo.height);
  return { width: Math.max(1, Math.round(photo.width * scale)), height: Math.max(1, Math.round(photo.height * scale)) };
}

export function photoUrl(photo: StoredPhoto, size: PhotoSize): PhotoVariant {
  const s = PHOTO_SIZES[size];
  const settings = cloudinarySettings();
  const url = getCldImageUrl(
    { src: photo.public_id, width: s.width, height: s.height, crop: s.crop, format: "auto", quality: "auto" },
    {
      cloud: { cloudName: settings.cloudName },
      url: { secure: settings.secure, ...(settings.deliveryHost ? { cname: settings.deliveryHost } : {}), analytics: false },
    },
  );
  const dims = s.crop === "fill" ? { width: s.width, height: s.height } : limitedSize(photo, s);
  return { url, ...dims };
}
