import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import type { ReactNode } from "react";
import "./globals.css";
import { Providers } from "./providers";
import { SiteHeader } from "@/components/shell/site-header";
import { currentUser } from "@/lib/auth/current-user";
import { viewerUnits } from "@/lib/units/viewer";
import { countNewAlerts } from "@/lib/services/needs/count-new-alerts";

export const metadata: Metadata = {
  title: { default: "Duffbank", template: "%s · Duffbank" },
  description: "Plan a no-dig bed, find the leaves, straw, cardboard and worms it needs nearby, and pass on what you have spare.",
  icons: { icon: "/icon.svg" },
};

// One variable font file (every weight), shipped with the app and preloaded; text shows at
// once in a fallback sized to match, so the swap moves nothing.
const workSans = localFont({
  src: "../node_modules/@fontsource-variable/work-sans/files/work-sans-latin-wght-normal.woff2",
  weight: "100 900",
  display: "swap",
  variable: "--font-work-sans",
});

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#40642e" };

export default async function RootLayout({ children }: { children: ReactNode }) {
  const user = await currentUser();
  const units = await viewerUnits(user);
  // Listings found for a gardener's open needs that they have not looked at yet.
  const newAlerts = user?.roles.includes("gardener") ? await countNewAlerts(user.id) : 0;
  return (
    <html lang="en" className={workSans.variable}>
      <body className="flex min-h-screen flex-col">
        <Providers units={units}>
          <SiteHeader user={user} counts={{ "/needs": newAlerts }} />
          <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
            {children}
          </main>
          <footer className="border-t border-humus-200 bg-humus-100 px-4 py-6 text-sm text-humus-700">
            <div className="mx-auto max-w-6xl">
              Duffbank passes spare organic material on to new garden beds. Quantities are estimates; follow local rules and licensed advice on safety,
              water and waste.
            </div>
          </footer>
        </Providers>
      </body>
    </html>
  );
}
