"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch, isApiError } from "@/lib/api/client";
import { Button } from "@/components/ui/button";

export function RoleRequestActions({ userId, role }: { userId: string; role: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const decide = async (decision: "approve" | "refuse") => {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/moderation/role-requests/${userId}`, { method: "POST", body: { role, decision } });
      router.refresh();
    } catch (err) {
      setError(isApiError(err) ? err.message : "That did not work.");
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="flex items-center gap-2">
      <Button onClick={() => decide("approve")} disabled={busy}>
        Approve
      </Button>
      <Button variant="secondary" onClick={() => decide("refuse")} disabled={busy}>
        Refuse
      </Button>
      {error ? <span role="alert" className="text-sm text-ember-600">{error}</span> : null}
    </div>
  );
}
