import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { inter } from "./fonts";
import { PwaRuntime } from "@/components/pwa/pwa-runtime";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Benchwright", template: "%s · Benchwright" },
  description: "Offline-first bench companion for small-engine and outdoor power equipment repair shops.",
  applicationName: "Benchwright",
  icons: {
    icon: [
      { url: "/favicon.ico", sizes: "16x16 32x32" },
      { url: "/icons/icon-192.png", sizes: "192x192", type: "image/png" },
    ],
    apple: [{ url: "/icons/apple-touch-icon.png", sizes: "180x180" }],
  },
  appleWebApp: { capable: true, title: "Benchwright", statusBarStyle: "default" },
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f6f6f9" },
    { media: "(prefers-color-scheme: dark)", color: "#0f0f15" },
  ],
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-dvh font-sans antialiased">
        <PwaRuntime />
        {children}
      </body>
    </html>
  );
}
