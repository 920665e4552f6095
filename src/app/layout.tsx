import type { Metadata } from "next";
import localFont from "next/font/local";
import "./globals.css";

const body = localFont({
  src: "./fonts/inter-latin-wght-normal.woff2",
  variable: "--font-body",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Knucklebench", template: "%s · Knucklebench" },
  description: "Front-corner geometry, steer lock and drive-shaft checks for small driven vehicles.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={body.variable}>
      <body className="min-h-screen font-sans antialiased">{children}</body>
    </html>
  );
}
