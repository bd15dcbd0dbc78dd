"use client";
import { useEffect, useRef, useState } from "react";
import { apiFetch, isApiError } from "@/lib/api/client";
import { MAX_PHOTOS, type UploadedPhoto } from "@/lib/validation/listings";
import { megabytes, signUpload, uploadPhoto } from "./upload-photo";

// Up to six photos, each with its own progress bar, reorderable with buttons (so it works
// by keyboard and on a phone), the first one the cover. A new listing keeps the verified
// upload results in the form until it is posted; an existing one saves each change at once.

interface Item {
  key: string;
  name: string;
  url: string | null;
  /** The chosen file, shown from the browser's memory while it uploads. */
  preview?: string;
  state: "uploading" | "done" | "error";
  progress: number;
  error?: string;
  upload?: UploadedPhoto;
  /** listing_photos id, once the server holds it (edit mode). */
  recordId?: string;
}

export interface PhotoRecord {
  id: string;
  url: string;
}

type Props =
  | { mode: "create"; onChange: (photos: UploadedPhoto[]) => void }
  | { mode: "edit"; listingId: string; initial: PhotoRecord[] };

const fromRecords = (records: PhotoRecord[]): Item[] =>
  records.map((r, i) => ({ key: r.id, recordId: r.id, name: `Photo ${i + 1}`, url: r.url, state: "done", progress: 1 }));

let counter = 0;

export function PhotoManager(props: Props) {
  const [items, setItems] = useState<Item[]>(props.mode === "edit" ? fromRecords(props.initial) : []);
  const [notice, setNotice] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const kept = items.filter((i) => i.state !== "error");

  // A new listing's form holds the finished uploads, in order.
  const onChange = props.mode === "create" ? props.onChange : null;
  useEffect(() => {
    onChange?.(items.filter((i) => i.state === "done" && i.upload).map((i) => i.upload!));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [items]);

  const publish = (next: Item[]) => setItems(next);
  const patch = (key: string, change: Partial<Item>) => setItems((prev) => prev.map((i) => (i.key === key ? { ...i, ...change } : i)));
  const fromServer = (records: PhotoRecord[]) => setItems((prev) => [...fromRecords(records), ...prev.filter((i) => i.state !== "done")]);

  async function addFiles(files: FileList | null) {
    setNotice(null);
    if (!files || files.length === 0) return;
    const room = MAX_PHOTOS - kept.length;
    const chosen = [...files].slice(0, Math.max(0, room));
    if (files.length > room) setNotice(`A listing can show ${MAX_PHOTOS} photos; ${room === 0 ? "remove one to add another" : `only the first ${room} were added`}.`);
    if (chosen.length === 0) return;
    let signed;
    try {
      signed = await signUpload();
    } catch (err) {
      setNotice(isApiError(err) ? err.message : "Uploading is not available right now. Try again in a moment.");
      return;
    }
    const fresh: Item[] = chosen.map((f) => ({ key: `new-${++counter}`, name: f.name, url: null, preview: URL.createObjectURL(f), state: "uploading", progress: 0 }));
    setItems((prev) => [...prev, ...fresh]);
    await Promise.all(
      chosen.map(async (file, n) => {
        const key = fresh[n].key;
        // Checked here only to spare a pointless upload; the image service checks again.
        if (file.size > signed.max_bytes) {
          patch(key, { state: "error", error: `${file.name} is ${megabytes(file.size)}; the limit is ${megabytes(signed.max_bytes)}.` });
          return;
        }
        try {
          const result = await uploadPhoto(file, signed, (p) => patch(key, { progress: p }));
          URL.revokeObjectURL(fresh[n].preview!);
          const { secure_url, ...upload } = result;
          if (props.mode === "create") {
            patch(key, { state: "done", progress: 1, url: secure_url, upload });
          } else {
            const res = await apiFetch<{ photos: PhotoRecord[] }>(`/api/listings/${props.listingId}/photos`, { method: "POST", body: { photos: [upload] } });
            setItems((prev) => prev.filter((i) => i.key !== key));
            fromServer(res.photos);
          }
        } catch (err) {
          patch(key, { state: "error", error: `${file.name}: ${err instanceof Error ? err.message : "the upload failed."}` });
        }
      }),
    );
    if (input.current) input.current.value = "";
  }

  async function move(index: number, by: -1 | 1) {
    const done = items.filter((i) => i.state === "done");
    const target = index + by;
    if (target < 0 || target >= done.length) return;
    const order = [...done];
    [order[index], order[target]] = [order[target], order[index]];
    if (props.mode === "create") return publish([...order, ...items.filter((i) => i.state !== "done")]);
    try {
      const res = await apiFetch<{ photos: PhotoRecord[] }>(`/api/listings/${props.listingId}/photos`, { method: "PATCH", body: { order: order.map((i) => i.recordId!) } });
      fromServer(res.photos);
    } catch (err) {
      setNotice(isApiError(err) ? err.message : "The new order could not be saved.");
    }
  }

  async function remove(item: Item) {
    if (props.mode === "create" || !item.recordId) return publish(items.filter((i) => i.key !== item.key));
    try {
      const res = await apiFetch<{ photos: PhotoRecord[] }>(`/api/listings/${props.listingId}/photos`, { method: "DELETE", body: { photo_id: item.recordId } });
      fromServer(res.photos);
    } catch (err) {
      setNotice(isApiError(err) ? err.message : "The photo could not be removed.");
    }
  }

  const done = items.filter((i) => i.state === "done");
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <label className={`inline-flex min-h-11 cursor-pointer items-center rounded-lg bg-white px-4 py-2.5 font-semibold ring-1 ring-humus-300 hover:bg-humus-100 ${kept.length >= MAX_PHOTOS ? "pointer-events-none opacity-50" : ""}`}>
          Add photos
          <input
            ref={input}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            multiple
            className="sr-only"
            disabled={kept.length >= MAX_PHOTOS}
            onChange={(e) => void addFiles(e.target.files)}
          />
        </label>
        <p className="text-sm text-humus-600">
          {kept.length} of {MAX_PHOTOS}. JPEG, PNG or WebP up to 10 MB. Location and camera details are removed from every photo.
        </p>
      </div>
      <p aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {notice ?? ""}
      </p>
      {items.length > 0 ? (
        <ol className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="Photos, in the order shown">
          {items.map((item) => {
            const index = done.indexOf(item);
            return (
              <li key={item.key} className="flex flex-col gap-2 rounded-lg bg-white p-2 ring-1 ring-humus-200">
                <div className="relative aspect-[4/3] overflow-hidden rounded bg-humus-100">
                  {item.url ? (
                    // eslint-disable-next-line @next/next/no-img-element
                    <img src={item.url} alt={`Photo ${index + 1}`} className="h-full w-full object-cover" />
                  ) : item.preview && item.state === "uploading" ? (
                    <>
                      {/* eslint-disable-next-line @next/next/no-img-element */}
                      <img src={item.preview} alt={`${item.name}, uploading`} className="h-full w-full object-cover" />
                      {/* A veil that lifts as the upload goes through. */}
                      <span aria-hidden="true" className="absolute inset-x-0 top-0 bg-humus-50/75 transition-[height]" style={{ height: `${100 - Math.round(item.progress * 100)}%` }} />
                    </>
                  ) : (
                    <div className="flex h-full items-center justify-center p-2 text-center text-xs text-humus-600">{item.name}</div>
                  )}
                </div>
                {item.state === "error" ? (
                  <p role="alert" className="text-sm text-ember-800">
                    {item.error}
                  </p>
                ) : (
                  <div className="flex flex-col gap-1">
                    <progress
                      className="h-2 w-full"
                      max={100}
                      value={Math.round(item.progress * 100)}
                      aria-label={`Upload of ${item.name}`}
                    />
                    <span className="text-xs text-humus-600">{item.state === "uploading" ? `Uploading… ${Math.round(item.progress * 100)} %` : index === 0 ? "Uploaded · cover photo" : "Uploaded"}</span>
                  </div>
                )}
                <div className="flex flex-wrap gap-1 text-sm">
                  {item.state === "done" ? (
                    <>
                      <button type="button" className="rounded px-2 py-1 ring-1 ring-humus-300 disabled:opacity-40" disabled={index === 0} onClick={() => void move(index, -1)} aria-label={`Move photo ${index + 1} earlier`}>
                        ←
                      </button>
                      <button type="button" className="rounded px-2 py-1 ring-1 ring-humus-300 disabled:opacity-40" disabled={index === done.length - 1} onClick={() => void move(index, 1)} aria-label={`Move photo ${index + 1} later`}>
                        →
                      </button>
                    </>
                  ) : null}
                  {item.state !== "uploading" ? (
                    <button type="button" className="ml-auto rounded px-2 py-1 text-ember-800 ring-1 ring-ember-600/40" onClick={() => void remove(item)} aria-label={`Remove ${item.state === "error" ? item.name : `photo ${index + 1}`}`}>
                      Remove
                    </button>
                  ) : null}
                </div>
              </li>
            );
          })}
        </ol>
      ) : null}
    </div>
  );
}
