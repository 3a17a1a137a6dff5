import type { Metadata } from "next";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { SiteHeader } from "@/components/site-header";
import { ZodSetup } from "@/components/zod-setup";
import { displayFont, monoFont, sansFont } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Quireline", template: "%s · Quireline" },
  description:
    "From open call to contributor payouts: Quireline runs collaborative zines and small-press anthologies.",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request: its scripts carry that request's CSP nonce (proxy.ts),
  // which a page prerendered at build time could not.
  await connection();
  return (
    <html lang="en" className={`${displayFont.variable} ${sansFont.variable} ${monoFont.variable}`}>
      <body className="min-h-screen">
        <ZodSetup />
        <SiteHeader />
        <main className="mx-auto max-w-6xl px-5 py-8">{children}</main>
        <footer className="mx-auto max-w-6xl px-5 pb-10 pt-6 text-xs text-ink-faint">
          Quireline keeps records for small presses. Payout figures are records, not tax or legal
          advice.
        </footer>
      </body>
    </html>
  );
}
