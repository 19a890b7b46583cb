import type { Metadata } from "next";
import type { ReactNode } from "react";

import { plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Sagline", template: "%s · Sagline" },
  description: "Serviceability screening for structural member schedules.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={plexSans.variable}>
      <body className="min-h-screen font-sans text-sm antialiased">{children}</body>
    </html>
  );
}
