"use client";
import { useState } from "react";
import { SubmitKeys } from "@/lib/api/client";

/** The Idempotency-Keys of one form or button group, kept across renders (lib/api/client.ts). */
export function useSubmitKeys(): SubmitKeys {
  const [keys] = useState(() => new SubmitKeys());
  return keys;
}
