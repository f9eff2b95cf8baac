import { describe, expect, it } from "vitest";
import { clientAddress, trustedProxyHops, UNKNOWN_ADDRESS } from "@/lib/auth/client-address";

describe("clientAddress: which address sign-in throttling counts", () => {
  it("reads TRUST_PROXY as a number of proxies; unset means none", () => {
    expect([undefined, "", "0", "false", "no", "-1", "x"].map((v) => trustedProxyHops(v))).toEqual([
      0, 0, 0, 0, 0, 0, 0,
    ]);
    expect([trustedProxyHops("1"), trustedProxyHops("true"), trustedProxyHops(" 2 ")]).toEqual([1, 1, 2]);
  });

  it("without a declared proxy ignores forwarded headers: every caller is in one bucket", () => {
    for (const xff of ["198.51.100.1", "203.0.113.5, 198.51.100.1", undefined]) {
      expect(clientAddress({ "x-forwarded-for": xff, "x-real-ip": "192.0.2.1" }, 0)).toBe(UNKNOWN_ADDRESS);
    }
  });

  it("behind n proxies takes the n-th entry from the right, never what the client wrote further left", () => {
    expect(clientAddress({ "x-forwarded-for": "6.6.6.6, 203.0.113.5" }, 1)).toBe("203.0.113.5");
    expect(clientAddress({ "x-forwarded-for": "6.6.6.6, 203.0.113.5, 10.0.0.2" }, 2)).toBe("203.0.113.5");
    expect(clientAddress({ "x-forwarded-for": ["6.6.6.6", "203.0.113.5"] }, 1)).toBe("203.0.113.5");
    expect(clientAddress({ "x-forwarded-for": "203.0.113.5" }, 3)).toBe("203.0.113.5");
  });

  it("spells one address one way and refuses what is not an address", () => {
    expect(clientAddress({ "x-forwarded-for": "::ffff:203.0.113.5" }, 1)).toBe("203.0.113.5");
    expect(clientAddress({ "x-forwarded-for": "203.0.113.5:4431" }, 1)).toBe("203.0.113.5");
    expect(clientAddress({ "x-forwarded-for": "[2001:DB8::1]:443" }, 1)).toBe("2001:db8::1");
    expect(clientAddress({ "x-forwarded-for": "not-an-address" }, 1)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress({}, 1)).toBe(UNKNOWN_ADDRESS);
  });
});
