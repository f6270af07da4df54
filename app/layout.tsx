import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { headers } from "next/headers";
import "./globals.css";

const body = localFont({
  src: [
    { path: "./fonts/atkinson-hyperlegible-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "./fonts/atkinson-hyperlegible-latin-400-italic.woff2", weight: "400", style: "italic" },
    { path: "./fonts/atkinson-hyperlegible-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-body",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Greaseledger", template: "%s · Greaseledger" },
  description: "Grease compatibility and lubricant inventory for lubrication teams.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#2c4a5a" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request makes every page dynamic, so each response carries its own CSP nonce.
  await headers();
  return (
    <html lang="en" className={body.variable}>
      <body>{children}</body>
    </html>
  );
}
