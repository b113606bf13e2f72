import type { Metadata } from "next";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { mono, sans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Gelwright", template: "%s · Gelwright" },
  description: "Hybrid sol-gel formulations: recipes, thermal checks, review and batch records for a team.",
  icons: { icon: { url: "/icon.svg", type: "image/svg+xml" } },
  manifest: "/manifest.webmanifest",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request, so that Next.js can put this
  // response's script nonce (from the policy the HTTP front sets) on its
  // scripts; a page prerendered at build time would carry none and not run.
  await connection();
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen antialiased">{children}</body>
    </html>
  );
}
