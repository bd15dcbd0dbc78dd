"use client";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";

export function AcceptInvite({ token, organisation }: { token: string; organisation: string }) {
  const router = useRouter();
  const action = useApiAction();
  return (
    <div className="flex flex-col gap-3">
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <Button
        disabled={action.busy}
        onClick={() => action.run("/api/council/invites/accept", { body: { token } }, () => router.push("/council"))}
      >
        {action.busy ? "Joining…" : `Join ${organisation}'s staff`}
      </Button>
    </div>
  );
}
