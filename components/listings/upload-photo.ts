// Browser side of a photo upload: the app signs, then the file goes straight from the
// browser to the image service (the local fake, or Cloudinary itself) — never through our
// server. XMLHttpRequest rather than fetch, because only XHR reports upload progress.
import { apiFetch } from "@/lib/api/client";
import type { UploadedPhoto } from "@/lib/validation/listings";

export interface SignedUpload {
  upload_url: string;
  api_key: string;
  timestamp: number;
  folder: string;
  signature: string;
  max_bytes: number;
  accept: string[];
}

export interface UploadResult extends UploadedPhoto {
  secure_url: string;
}

export function signUpload(): Promise<SignedUpload> {
  return apiFetch<SignedUpload>("/api/media/sign", { method: "POST", body: {} });
}

export function uploadPhoto(file: File, signed: SignedUpload, onProgress: (fraction: number) => void): Promise<UploadResult> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append("api_key", signed.api_key);
    form.append("timestamp", String(signed.timestamp));
    form.append("folder", signed.folder);
    form.append("signature", signed.signature);
    form.append("file", file);
    const xhr = new XMLHttpRequest();
    xhr.open("POST", signed.upload_url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      const body = xhr.response as (Partial<UploadResult> & { error?: { message?: string } }) | null;
      if (xhr.status === 200 && body?.public_id) {
        onProgress(1);
        resolve({
          public_id: body.public_id,
          version: Number(body.version),
          signature: String(body.signature),
          width: Number(body.width),
          height: Number(body.height),
          format: body.format as UploadedPhoto["format"],
          secure_url: String(body.secure_url),
        });
      } else {
        reject(new Error(body?.error?.message ?? `The upload failed (${xhr.status || "no answer"}).`));
      }
    };
    xhr.onerror = () => reject(new Error("The photo could not be sent. Check your connection and try again."));
    xhr.send(form);
  });
}

export const megabytes = (n: number) => `${Math.round((n / (1024 * 1024)) * 10) / 10} MB`;
