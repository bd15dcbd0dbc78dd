"use client";
import { useSyncExternalStore } from "react";

const noSubscription = () => () => {};

/** False while the page is server HTML only, true once React runs in the browser. */
export function useHydrated() {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}
