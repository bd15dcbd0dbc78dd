"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch } from "@/lib/api/client";
import { Button } from "@/components/ui/button";

export function DeleteBedButton({ id, name }: { id: string; name: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const remove = async () => {
    if (!window.confirm(`Delete "${name}"? Its reminders stop too.`)) return;
    try {
      await apiFetch(`/api/beds/${id}`, { method: "DELETE" });
      router.push("/beds");
      router.refresh();
    } catch {
      setError("The bed could not be deleted. Please try again.");
    }
  };
  return (
    <>
      <Button variant="secondary" onClick={remove}>
        Delete bed
      </Button>
      {error ? <span role="alert" className="text-sm text-ember-600">{error}</span> : null}
    </>
  );
}
