import type { NextConfig } from "next";
import { API_CONTENT_SECURITY_POLICY, contentSecurityPolicy, STATIC_SECURITY_HEADERS } from "./lib/security/headers";

const entries = (headers: Record<string, string>) => Object.entries(headers).map(([key, value]) => ({ key, value }));

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // Uploads go through route handlers with their own 10 MB limit; server actions stay small.
  experimental: { serverActions: { bodySizeLimit: "1mb" } },
  /**
   * Applied by Next.js before anything else, to every response it sends (pages, API, static
   * files, 404s). The policy here has no nonce, so it lets no inline script run; pages get the
   * per-request policy from proxy.ts, which replaces this one, and HSTS, which depends on the
   * URL the app is served at when it runs (these headers are fixed when it is built).
   */
  async headers() {
    return [
      {
        source: "/:path*",
        headers: entries({ ...STATIC_SECURITY_HEADERS, "Content-Security-Policy": contentSecurityPolicy({ dev: process.env.NODE_ENV === "development" }) }),
      },
      { source: "/api/:path*", headers: entries({ "Content-Security-Policy": API_CONTENT_SECURITY_POLICY, "Cache-Control": "no-store" }) },
    ];
  },
};

export default nextConfig;
