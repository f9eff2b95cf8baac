import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // Uploads go through route handlers with their own 10 MB limit; server actions stay small.
  experimental: { serverActions: { bodySizeLimit: "1mb" } },
};

export default nextConfig;
