"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch, isApiError } from "@/lib/api/client";
import type { EstimateRequest } from "@/lib/validation/estimate";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { inputClass } from "@/components/ui/field";

/** Saves the planned bed (POST /api/beds) or the bed being edited (PATCH). */
export function SaveBed({ request, location, bed }: { request: EstimateRequest; location: { lat: number; lng: number } | null; bed?: { id: string; name: string } }) {
  const router = useRouter();
  const [name, setName] = useState(bed?.name ?? "");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const save = async () => {
    setBusy(true);
    setError(null);
    const body = { name, bed: request.bed, layers: request.layers, start_date: request.start_date ?? null, location };
    try {
      const res = await apiFetch<{ bed: { id: string } }>(bed ? `/api/beds/${bed.id}` : "/api/beds", { method: bed ? "PATCH" : "POST", body });
      router.push(`/beds/${res.bed.id}`);
      router.refresh();
    } catch (err) {
      setError(isApiError(err) ? (err.fields?.name ?? err.message) : "Saving failed. Please try again.");
      setBusy(false);
    }
  };

  return (
    <div className="flex flex-col gap-2 rounded-lg bg-moss-50 p-4 ring-1 ring-moss-200">
      <label htmlFor="bed-name" className="font-medium">
        {bed ? "Bed name" : "Save this bed as"}
      </label>
      <div className="flex flex-wrap gap-2">
        <input
          id="bed-name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          placeholder="e.g. Back fence bed"
          aria-describedby="bed-name-error"
          className={`${inputClass} flex-1`}
        />
        <Button onClick={save} disabled={busy}>
          {busy ? "Saving…" : bed ? "Save changes" : "Save bed"}
        </Button>
      </div>
      <p id="bed-name-error" aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {error ?? ""}
      </p>
      {!bed ? <p className="text-sm text-humus-700">Saved beds get their timeline by e-mail and as a calendar file.</p> : null}
      {error && !name ? <Notice tone="error">Give the bed a name first.</Notice> : null}
    </div>
  );
}
