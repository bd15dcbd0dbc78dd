"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";

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
  const noteId = `note-${reportId}`;
  const many = p.reportIds.length > 1;
  const go = (path: string | string[], body: Record<string, unknown>) => {
    if (note.trim().length < 3) {
      setNoteError("Write a short note first (at least 3 characters): it goes into the audit log.");
      return;
    }
    setNoteError(null);
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
        className="rounded-lg border border-humus-300 bg-white px-3 py-2"
      />
      <p id={`${noteId}-error`} aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {noteError ?? ""}
      </p>
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <div className="flex flex-wrap gap-2">
        {p.listingId ? (
          <Button variant={p.listingHidden ? "secondary" : "danger"} disabled={action.busy} onClick={() => go(`/api/moderation/listings/${p.listingId}`, { action: p.listingHidden ? "restore" : "hide", report_id: reportId })}>
            {p.listingHidden ? "Show the listing again" : "Hide the listing"}
          </Button>
        ) : null}
        {p.userId ? (
          <>
            <Button variant={p.suspended ? "secondary" : "danger"} disabled={action.busy} onClick={() => go(`/api/moderation/users/${p.userId}`, { action: p.suspended ? "restore" : "suspend", report_id: reportId })}>
              {p.suspended ? `Lift ${p.userName}'s suspension` : `Suspend ${p.userName}`}
            </Button>
            <Button variant="secondary" disabled={action.busy} onClick={() => go(`/api/moderation/users/${p.userId}`, { action: p.verified ? "unverify" : "verify", report_id: reportId })}>
              {p.verified ? "Remove the verified badge" : "Verify as a supplier"}
            </Button>
          </>
        ) : null}
        {p.open ? (
          <Button disabled={action.busy} onClick={() => go(p.reportIds.map((id) => `/api/moderation/reports/${id}/close`), {})}>
            {many ? `Close all ${p.reportIds.length} reports` : "Close the report"}
          </Button>
        ) : null}
      </div>
    </div>
  );
}
