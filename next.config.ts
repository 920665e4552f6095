import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // pg, pg-boss, the Neon driver and pdfkit (which reads its own data files) are plain Node modules: keep them out of the server bundle.
  serverExternalPackages: ["pg", "pg-boss", "@neondatabase/serverless", "pdfkit"],
};

export default nextConfig;
