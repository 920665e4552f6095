import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // pg and the Neon driver are plain Node modules: keep them out of the server bundle.
  serverExternalPackages: ["pg", "@neondatabase/serverless"],
};

export default nextConfig;
