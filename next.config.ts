import { realpathSync } from "node:fs";
import { dirname, relative, resolve, sep } from "node:path";
import type { NextConfig } from "next";
import { API_CONTENT_SECURITY_POLICY, contentSecurityPolicy, STATIC_SECURITY_HEADERS } from "./lib/security/headers";

const entries = (headers: Record<string, string>) => Object.entries(headers).map(([key, value]) => ({ key, value }));

/**
 * Turbopack compiles only files under its root. A git worktree that shares another checkout's
 * node_modules through a symlink keeps its packages outside this folder, so the root has to
 * reach up to the folder both live in. With a real node_modules this is this folder, the default.
 */
function buildRoot(): string {
  const here = resolve(".");
  let modules: string;
  try {
    modules = dirname(realpathSync("node_modules"));
  } catch {
    return here;
  }
  let root = here;
  while (relative(root, modules).startsWith("..") && dirname(root) !== root) root = dirname(root);
  return root.endsWith(sep) ? root.slice(0, -1) || sep : root;
}

const nextConfig: NextConfig = {
  poweredByHeader: false,
  turbopack: { root: buildRoot() },
  // Uploads go through route handlers with their own 10 MB limit; server actions stay small.
  experimental: { serverActions: { bodySizeLimit: "1mb" } },
  /** Squads, the staff home, lists the squads; the old address of a second list leads there. */
  async redirects() {
    return [{ source: "/squads", destination: "/", permanent: false }];
  },
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
        headers: entries({
          ...STATIC_SECURITY_HEADERS,
          "Content-Security-Policy": contentSecurityPolicy({ dev: process.env.NODE_ENV === "development" }),
        }),
      },
      {
        source: "/api/:path*",
        headers: entries({ "Content-Security-Policy": API_CONTENT_SECURITY_POLICY, "Cache-Control": "no-store" }),
      },
    ];
  },
};

export default nextConfig;
