import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // pg, pg-boss, the Neon driver and pdfkit (which reads its own data files) are plain Node modules: keep them out of the server bundle.
  serverExternalPackages: ["pg", "pg-boss", "@neondatabase/serverless", "pdfkit"],
  // A shared kit's page stays out of search engines (its API answers set the same header themselves).
  async headers() {
    return [{ source: "/shared/:path*", headers: [{ key: "X-Robots-Tag", value: "noindex, nofollow" }, { key: "Referrer-Policy", value: "no-referrer" }] }];
  },
};

export default nextConfig;
