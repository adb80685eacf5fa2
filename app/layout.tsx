import type { Metadata, Viewport } from "next";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Bidwright", template: "%s · Bidwright" },
  description: "Crew bidding and roster fairness",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#0f3b57" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body className="min-h-dvh bg-slate-50 font-sans text-slate-900 antialiased">{children}</body>
    </html>
  );
}
