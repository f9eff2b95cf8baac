import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Changewise", template: "%s · Changewise" },
  description:
    "Pre/post testing for strength and conditioning: real change against test noise and the smallest worthwhile change.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#1E2A44" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request, so each carries the nonce of its own Content-Security-
  // Policy (proxy.ts); a page built ahead of time would hold scripts the policy blocks.
  await connection();
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper font-sans text-ink antialiased">{children}</body>
    </html>
  );
}
