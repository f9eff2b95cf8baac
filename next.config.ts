import { realpathSync } from "node:fs";
import { dirname, relative, resolve, sep } from "node:path";
import type { NextConfig } from "next";

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
};

export default nextConfig;
