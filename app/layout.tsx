import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { Toaster } from "@/components/ui";
import { QueryProvider } from "@/components/providers/query-provider";
import { publicSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Rigline", template: "%s · Rigline" },
  description: "Fit-out control for vehicles that work in remote country",
  icons: { icon: "/icon.svg" },
  manifest: "/manifest.webmanifest",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1 };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en-AU" className={publicSans.variable}>
      <body className="min-h-dvh bg-surface font-sans text-ink antialiased">
        <QueryProvider>{children}</QueryProvider>
        <Toaster />
      </body>
    </html>
  );
}
