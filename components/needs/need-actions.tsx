"use client";
import { useApiAction } from "@/components/ui/use-api-action";
import { smallButtonClass } from "@/components/ui/button-class";
import type { NeedView } from "@/lib/needs/view";

const plain = smallButtonClass();

/** Close, open again, switch how alerts come, or delete: each asks the server, then the page reloads its data. */
export function NeedActions({ need, label }: { need: Pick<NeedView, "id" | "status" | "alerts">; label: string }) {
  const { run, busy, error } = useApiAction();
  const patch = (body: Record<string, unknown>) => void run(`/api/needs/${need.id}`, { method: "PATCH", body });
  const remove = () => {
    if (window.confirm(`Delete the need for ${label}? Its alerts go with it.`)) void run(`/api/needs/${need.id}`, { method: "DELETE" });
  };
  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap gap-2">
        {need.status === "open" ? (
          <>
            <button type="button" className={plain} disabled={busy} onClick={() => patch({ status: "closed" })} aria-label={`Close the need for ${label}`}>
              Close
            </button>
            <button
              type="button"
              className={plain}
              disabled={busy}
              onClick={() => patch({ alerts: need.alerts === "daily" ? "immediate" : "daily" })}
              aria-label={`${need.alerts === "daily" ? "E-mail me at once instead" : "E-mail me once a day instead"}, for ${label}`}
            >
              {need.alerts === "daily" ? "E-mail me at once instead" : "E-mail me once a day instead"}
            </button>
          </>
        ) : (
          <button type="button" className={plain} disabled={busy} onClick={() => patch({ status: "open" })} aria-label={`Open the need for ${label} again`}>
            Open again
          </button>
        )}
        <button type="button" className={smallButtonClass("danger")} disabled={busy} onClick={remove} aria-label={`Delete the need for ${label}`}>
          Delete
        </button>
      </div>
      <p aria-live="polite" className="text-sm text-ember-800">
        {error ?? ""}
      </p>
    </div>
  );
}

/** Put a notice away. */
export function DismissAlert({ id, label }: { id: string; label: string }) {
  const { run, busy, error } = useApiAction();
  return (
    <>
      <button type="button" className={plain} disabled={busy} onClick={() => void run(`/api/needs/alerts/${id}`, { method: "PATCH", body: { dismissed: true } })} aria-label={`Dismiss ${label}`}>
        Dismiss
      </button>
      {error ? <span className="text-sm text-ember-800">{error}</span> : null}
    </>
  );
}
