import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { Providers } from "./providers";
import "./globals.css";

// Fonts ship with the app (copied from @fontsource-variable packages); nothing is fetched.
const sans = localFont({
  src: [
    { path: "./fonts/public-sans.woff2", style: "normal", weight: "100 900" },
    { path: "./fonts/public-sans-italic.woff2", style: "italic", weight: "100 900" },
  ],
  variable: "--font-portolan-sans",
  display: "swap",
});
const mono = localFont({ src: "./fonts/jetbrains-mono.woff2", variable: "--font-portolan-mono", weight: "100 800", display: "swap" });

export const metadata: Metadata = {
  title: { default: "Portolan", template: "%s · Portolan" },
  description: "Port programs, masters and the cut record of a cylinder-head porting shop.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#33312e" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen bg-paper font-sans text-ink antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
