import type { Metadata } from "next";
import type { ReactNode } from "react";
import { mono, sans } from "@/lib/fonts";
import "./globals.css";

// Every page is rendered per request, so each gets the fresh nonce of its Content-Security-Policy (see proxy.ts).
export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: { default: "Shearwire", template: "%s · Shearwire" },
  description: "The integration hub between a fabrication shop's office systems and its CNC guillotine shears.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
