import type { Metadata } from "next";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Sealpitch", template: "%s · Sealpitch" },
  description:
    "Plan bolt patterns on gasketed flanges and check that the gasket is seated everywhere along its path.",
  icons: { icon: "/sealpitch-mark.svg" },
};

// Every page renders per request (connection()), so each one gets the fresh CSP nonce that
// proxy.ts puts in the request's Content-Security-Policy; Next adds it to its own scripts. A
// prerendered page would carry no nonce and its scripts would be refused.
export default async function RootLayout({ children }: { children: ReactNode }) {
  await connection();
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
