"use client";
import { Button } from "@/components/ui/button";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <section className="mx-auto flex max-w-xl flex-col gap-4 py-10" role="alert">
      <h1 className="text-3xl font-bold">Something went wrong on our side</h1>
      <p className="text-humus-700">Nothing you entered was lost. Try again in a moment.</p>
      <Button onClick={reset} className="self-start">
        Try again
      </Button>
    </section>
  );
}
