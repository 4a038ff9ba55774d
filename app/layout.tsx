import type { Metadata } from "next";
import type { CSSProperties, ReactNode } from "react";
import { conditionCssVariables } from "@/components/condition/conditions";
import { inter } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Modewarden", template: "%s · Modewarden" },
  description: "Structural-health trending of civil assets from ambient vibration records.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={inter.variable} style={conditionCssVariables() as CSSProperties}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
