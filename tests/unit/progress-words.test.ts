/** My progress's sentences respect the test's direction; the consent rule's age boundary. */
import { describe, expect, it } from "vitest";
import { ageOn, checkConsent } from "@/lib/consent";
import { betterOrWorse, changeNote, changeSentence } from "@/lib/words/progress";

const sprint = {
  testName: "10 m sprint",
  unit: "s",
  decimals: 2,
  direction: "lower" as const,
  previousDate: "2026-09-07",
};
const jump = {
  testName: "Countermovement jump",
  unit: "cm",
  decimals: 1,
  direction: "higher" as const,
  previousDate: "2026-09-07",
};

describe("progress words", () => {
  it("a sprint time that falls is an improvement; a jump that falls is a step back", () => {
    expect(changeSentence({ ...sprint, change: -0.05 })).toMatch(
      /^Your 10 m sprint result fell by 0\.05 s since 7 Sept? 2026 — an improvement \(lower is better here\)\.$/,
    );
    expect(changeSentence({ ...jump, change: -1.2 })).toMatch(
      /fell by 1\.2 cm .* — a step back \(higher is better here\)\.$/,
    );
    expect(changeSentence({ ...jump, change: 0.04 })).toMatch(/did not change since/);
    expect(betterOrWorse(0.03, 2, "lower")).toBe("worse");
    expect(changeNote({ ...sprint, change: -0.05 })).toMatch(
      /^−0\.05 s since 7 Sept? 2026: an improvement, as lower is better here$/,
    );
  });
});

describe("consent", () => {
  it("counts whole years, the birthday itself included", () => {
    expect(ageOn("2008-11-09", "2026-11-08")).toBe(17);
    expect(ageOn("2008-11-09", "2026-11-09")).toBe(18);
    expect(ageOn("2008-02-29", "2026-02-28")).toBe(17);
  });

  it("needs a guardian's consent only while the athlete is under 18", () => {
    const minor = { dateOfBirth: "2010-01-01", consentRecordedOn: "2026-08-20", guardianConsentOn: null };
    expect(checkConsent(minor, "2026-11-02")).toEqual({ ok: false, minor: true, missing: ["guardian"] });
    expect(checkConsent(minor, "2028-01-01")).toEqual({ ok: true, minor: false, missing: [] });
    expect(checkConsent({ ...minor, consentRecordedOn: null }, "2026-11-02").missing).toEqual(["athlete", "guardian"]);
    expect(
      checkConsent({ dateOfBirth: null, consentRecordedOn: "2026-08-20", guardianConsentOn: null }, "2026-11-02").ok,
    ).toBe(true);
  });
});
