"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch, isApiError } from "@/lib/api/client";
import { actionsFor } from "@/lib/listings/status";
import type { ListingStatus } from "@/lib/listings/status";
import type { ListingAction } from "@/lib/validation/listings";
import { smallButtonClass } from "@/components/ui/button-class";

const LABELS: Record<ListingAction, string> = { publish: "Publish", pause: "Pause", resume: "Resume", archive: "Archive" };

/** The status buttons a listing's manager gets; each asks the server, then the page reloads its data. */
export function StatusActions({ id, status, title, compact = false }: { id: string; status: ListingStatus; title: string; compact?: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState<ListingAction | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function run(action: ListingAction) {
    if (action === "archive" && !window.confirm(`Archive “${title}”? It leaves browse for good.`)) return;
    setBusy(action);
    setError(null);
    try {
      await apiFetch(`/api/listings/${id}/status`, { method: "POST", body: { action } });
      router.refresh();
    } catch (err) {
      setError(isApiError(err) ? err.message : "That did not work. Try again.");
    } finally {
      setBusy(null);
    }
  }

  const actions = actionsFor(status);
  if (actions.length === 0) return null;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap gap-2">
        {actions.map((a) => (
          <button
            key={a}
            type="button"
            onClick={() => void run(a)}
            disabled={busy !== null}
            aria-label={compact ? `${LABELS[a]} “${title}”` : undefined}
            className={smallButtonClass(a === "archive" ? "danger" : "plain")}
          >
            {busy === a ? `${LABELS[a]}…` : LABELS[a]}
          </button>
        ))}
      </div>
      <p aria-live="polite" className="text-sm text-ember-800">
        {error ?? ""}
      </p>
    </div>
  );
}
