"use client";
import { createContext, useCallback, useContext, useState, type ReactNode } from "react";
import { useRouter } from "next/navigation";
import type { UnitSystem } from "@/lib/calc/units";
import { unitsCookie } from "@/lib/units/preference";

interface UnitsState {
  system: UnitSystem;
  setSystem: (s: UnitSystem) => void;
}

const UnitsContext = createContext<UnitsState>({ system: "metric", setSystem: () => undefined });

/**
 * The viewer's unit system for every client component, from the page that served it; the
 * switch changes it here and in this device's cookie, and asks the server pages to render
 * again in it. (The profile's "Measure in" is the account's default: e-mails, new devices.)
 */
export function UnitsProvider({ initial, children }: { initial: UnitSystem; children: ReactNode }) {
  const router = useRouter();
  const [system, set] = useState<UnitSystem>(initial);
  const setSystem = useCallback(
    (next: UnitSystem) => {
      set(next);
      document.cookie = unitsCookie(next);
      router.refresh();
    },
    [router],
  );
  return <UnitsContext.Provider value={{ system, setSystem }}>{children}</UnitsContext.Provider>;
}

export const useUnits = () => useContext(UnitsContext);
