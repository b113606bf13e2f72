import type { Metadata } from "next";
import type { ReactNode } from "react";
import { mono, sans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Gelwright", template: "%s · Gelwright" },
  description: "Hybrid sol-gel formulations: recipes, thermal checks, review and batch records for a team.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen antialiased">{children}</body>
    </html>
  );
}
