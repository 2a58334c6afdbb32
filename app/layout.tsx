import type { Metadata } from "next";
import type { ReactNode } from "react";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Sealpitch", template: "%s · Sealpitch" },
  description:
    "Plan bolt patterns on gasketed flanges and check that the gasket is seated everywhere along its path.",
  icons: { icon: "/sealpitch-mark.svg" },
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
