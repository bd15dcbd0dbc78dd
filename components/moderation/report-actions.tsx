"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { inputClass } from "@/components/ui/field";

export interface ReportActionsProps {
  /** The reports on one listing or person, oldest first: actions cite the first, closing closes them all. */
  reportIds: string[];
  listingId: string | null;
  listingHidden: boolean;
  userId: string | null;
  userName: string | null;
  suspended: boolean;
  verified: boolean;
  open: boolean;
}

/** A moderator's choices on one report. Every action needs a note: it goes into the audit log (and, on closing, to the reporter). */
export function ReportActions(p: ReportActionsProps) {
  const action = useApiAction();
  const [note, setNote] = useState("");
  const [noteError, setNoteError] = useState<string | null>(null);
  const reportId = p.reportIds[0];
  const many = p.reportIds.length > 1;
  // A step that takes something away from someone waits for a second, deliberate yes.
  const [confirm, setConfirm] = useState<{ title: string; yes: string; path: string; body: Record<string, unknown> } | null>(null);
  const noteId = `note-${reportId}`;
  const noted = () => {
    if (note.trim().length < 3) {
      setNoteError("Write a short note first (at least 3 characters): it goes into the audit log.");
      return false;
    }
    setNoteError(null);
    return true;
  };
  const ask = (c: NonNullable<typeof confirm>) => {
    if (noted()) setConfirm(c);
  };
  const go = (path: string | string[], body: Record<string, unknown>) => {
    if (!noted()) return;
    void (async () => {
      // Closing a group closes each report in turn, so every reporter hears the outcome.
      for (const one of Array.isArray(path) ? path : [path]) {
        const done = await action.run(one, { body: { ...body, note: note.trim() } });
        if (done === undefined) return;
      }
      if (Array.isArray(path)) setNote("");
    })();
  };
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={noteId} className="text-sm font-medium">
        Note for the record{p.open ? ` (sent to ${many ? `all ${p.reportIds.length} reporters` : "the reporter"} when you close)` : ""}
      </label>
      <textarea
        id={noteId}
        rows={2}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        aria-invalid={noteError ? true : undefined}
        aria-describedby={`${noteId}-error`}
        className={inputClass}
      />
      <p id={`${noteId}-error`} aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {noteError ?? ""}
      </p>
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <div className="flex flex-wrap gap-2">
        {p.listingId && p.listingHidden ? (
          <Button variant="secondary" disabled={action.busy} onClick={() => go(`/api/moderation/listings/${p.listingId}`, { action: "restore", report_id: reportId })}>
            Show the listing again
          </Button>
        ) : null}
        {p.userId && p.suspended ? (
          <Button variant="secondary" disabled={action.busy} onClick={() => go(`/api/moderation/users/${p.userId}`, { action: "restore", report_id: reportId })}>
            Lift {p.userName}&apos;s suspension
          </Button>
        ) : null}
        {p.userId ? (
          <Button variant="secondary" disabled={action.busy} onClick={() => go(`/api/moderation/users/${p.userId}`, { action: p.verified ? "unverify" : "verify", report_id: reportId })}>
            {p.verified ? "Take back “checked by Duffbank”" : "Mark as checked by Duffbank"}
          </Button>
        ) : null}
        {p.open ? (
          <Button disabled={action.busy} onClick={() => go(p.reportIds.map((id) => `/api/moderation/reports/${id}/close`), {})}>
            {many ? `Close all ${p.reportIds.length} reports` : "Close the report"}
          </Button>
        ) : null}
      </div>
      {(p.listingId && !p.listingHidden) || (p.userId && !p.suspended) ? (
        <div className="flex flex-col gap-2 rounded-lg border-2 border-dashed border-ember-600/60 bg-ember-100/50 p-3">
          <p className="text-sm font-semibold text-ember-800">Takes something away: asks again before it acts</p>
          <div className="flex flex-wrap gap-2">
            {p.listingId && !p.listingHidden ? (
              <Button
                variant="danger"
                disabled={action.busy}
                onClick={() => ask({ title: "Hide this listing?", yes: "Yes, hide the listing", path: `/api/moderation/listings/${p.listingId}`, body: { action: "hide", report_id: reportId } })}
              >
                Hide the listing
              </Button>
            ) : null}
            {p.userId && !p.suspended ? (
              <Button
                variant="danger"
                disabled={action.busy}
                onClick={() => ask({ title: `Suspend ${p.userName}?`, yes: `Yes, suspend ${p.userName}`, path: `/api/moderation/users/${p.userId}`, body: { action: "suspend", report_id: reportId } })}
              >
                Suspend {p.userName}
              </Button>
            ) : null}
          </div>
        </div>
      ) : null}
      <Dialog
        open={confirm !== null}
        onClose={() => setConfirm(null)}
        title={confirm?.title ?? ""}
        footer={
          <>
            <Button variant="secondary" onClick={() => setConfirm(null)}>
              Keep it as it is
            </Button>
            <Button
              variant="danger"
              disabled={action.busy}
              onClick={() => {
                const c = confirm!;
                setConfirm(null);
                go(c.path, c.body);
              }}
            >
              {confirm?.yes ?? "Yes"}
            </Button>
          </>
        }
      >
        <p>
          Your note goes into the audit log with it: <q>{note.trim()}</q>
        </p>
      </Dialog>
    </div>
  );
}
