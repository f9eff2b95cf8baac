import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/lib/safe-next";

const origin = "https://club.example";

describe("safeNextPath: where sign-in may send the browser", () => {
  it("keeps same-site paths with their query and fragment", () => {
    expect(safeNextPath("/squads/3", origin)).toBe("/squads/3");
    expect(safeNextPath("/sessions/12?tab=sheet#row-4", origin)).toBe("/sessions/12?tab=sheet#row-4");
    expect(safeNextPath("/athletes?q=a%20b", origin)).toBe("/athletes?q=a%20b");
  });

  it("falls back to home without a usable value", () => {
    for (const value of [null, undefined, "", "squads", "?x=1", "%"]) expect(safeNextPath(value, origin)).toBe("/");
  });

  it("refuses every way of naming another site", () => {
    const offSite = [
      "/\\evil.example/phish",
      "//evil.example",
      "///evil.example",
      "/\\/evil.example",
      "\\\\evil.example",
      "/\t/evil.example",
      "/\n/evil.example",
      "/.//evil.example",
      "/a/..//evil.example",
      "/%2e%2e//evil.example",
      "/%2F%2Fevil.example",
      "/%2f/evil.example",
      "/%5Cevil.example",
      "/%255C%255Cevil.example",
      "/%09/evil.example",
      "https://evil.example/",
      "http:evil.example",
      "javascript:alert(1)",
      "JaVaScRiPt:alert(1)",
      "%6Aavascript:alert(1)",
      " /\\evil.example",
      "data:text/html,hi",
    ];
    for (const value of offSite) expect([value, safeNextPath(value, origin)]).toEqual([value, "/"]);
  });
});
