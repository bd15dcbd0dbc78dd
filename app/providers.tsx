"use client";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { SessionProvider } from "next-auth/react";
import { useState, type ReactNode } from "react";
import type { UnitSystem } from "@/lib/calc/units";
import { UnitsProvider } from "@/components/ui/units-context";
import { ToastProvider } from "@/components/ui/toast";

export function createQueryClient() {
  return new QueryClient({ defaultOptions: { queries: { staleTime: 30_000, retry: 1, refetchOnWindowFocus: false } } });
}

export function Providers({ children, units }: { children: ReactNode; units: UnitSystem }) {
  const [client] = useState(createQueryClient);
  return (
    <SessionProvider>
      <QueryClientProvider client={client}>
        <UnitsProvider initial={units}>
          <ToastProvider>{children}</ToastProvider>
        </UnitsProvider>
      </QueryClientProvider>
    </SessionProvider>
  );
}
