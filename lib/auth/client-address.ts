import "server-only";
import { isIP } from "node:net";

/**
 * The bucket for callers whose address is not known. Next.js keeps an `X-Forwarded-For` the client
 * sent and fills in the socket address only when there is none, and an app route never sees the
 * socket itself; so without a declared proxy the header is the caller's own words, and every
 * caller shares this one bucket instead of choosing a fresh address per attempt.
 */
export const UNKNOWN_ADDRESS = "direct";

/**
 * `TRUST_PROXY`: how many reverse proxies in front of the app append to `X-Forwarded-For`.
 * Unset, empty, `0` or `false`: none, and forwarded headers are ignored. `1`/`true`: one.
 */
export function trustedProxyHops(value = process.env.TRUST_PROXY): number {
  const setting = value?.trim().toLowerCase() ?? "";
  if (setting === "true" || setting === "yes") return 1;
  const hops = Number(setting);
  return Number.isInteger(hops) && hops > 0 ? Math.min(hops, 20) : 0;
}

type Headers = Record<string, string | string[] | undefined> | undefined;

/**
 * The address the nearest trusted proxy saw: each proxy appends the address it was called from,
 * so with n proxies that is the n-th entry from the right. Entries further left came from the
 * client and are never read.
 */
export function clientAddress(headers: Headers, hops = trustedProxyHops()): string {
  if (hops === 0) return UNKNOWN_ADDRESS;
  const raw = headers?.["x-forwarded-for"];
  const entries = (Array.isArray(raw) ? raw.join(",") : (raw ?? ""))
    .split(",")
    .map((entry) => entry.trim())
    .filter(Boolean);
  if (entries.length === 0) return UNKNOWN_ADDRESS;
  return normaliseAddress(entries[Math.max(entries.length - hops, 0)]) ?? UNKNOWN_ADDRESS;
}

/** One spelling per address (IPv4-mapped IPv6, ports, brackets), or null if it is not one. */
function normaliseAddress(entry: string): string | null {
  let address = entry;
  const bracketed = /^\[([^\]]+)\](?::\d+)?$/.exec(address);
  if (bracketed) address = bracketed[1];
  else if (/^[\d.]+:\d+$/.test(address)) address = address.slice(0, address.lastIndexOf(":"));
  address = address.toLowerCase().replace(/^::ffff:(?=[\d.]+$)/, "");
  return isIP(address) ? address : null;
}
