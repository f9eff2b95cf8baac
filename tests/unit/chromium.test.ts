import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { type ChromiumProbe, DEBIAN_CHROMIUM, planChromium } from "../helpers/chromium";

const machine = (over: Partial<ChromiumProbe> & { working?: string[]; present?: string[] }): ChromiumProbe => {
  const working = over.working ?? [];
  const present = [...working, ...(over.present ?? [])];
  return {
    command: "npm test",
    chosen: undefined,
    starts: (path) => working.includes(path),
    exists: (path) => present.includes(path),
    isRoot: false,
    hasAptGet: true,
    ...over,
  };
};

/** What a person reads when the tests cannot go on: one line, one sentence. */
const expectOneSentence = (plan: ReturnType<typeof planChromium>) => {
  expect(plan).toHaveProperty("stop");
  const text = (plan as { stop: string }).stop;
  expect(text).not.toMatch(/\n/);
  expect(text).toMatch(/\.$/);
  expect(text.slice(0, -1)).not.toMatch(/[.!?]\s+[A-Z]/);
  return text;
};

describe("finding Chromium for the browser tests", () => {
  it("uses CHROMIUM_PATH when it starts, then Debian's package", () => {
    expect(planChromium(machine({ chosen: "/opt/chromium/chrome", working: ["/opt/chromium/chrome"] }))).toEqual({
      use: "/opt/chromium/chrome",
    });
    expect(planChromium(machine({ working: [DEBIAN_CHROMIUM] }))).toEqual({ use: DEBIAN_CHROMIUM });
  });

  it("reports a CHROMIUM_PATH that does not start instead of quietly using another browser", () => {
    const text = expectOneSentence(
      planChromium(machine({ chosen: "/opt/nothing", working: [DEBIAN_CHROMIUM], isRoot: true })),
    );
    expect(text).toContain("CHROMIUM_PATH is set to /opt/nothing");
  });

  it("installs Debian's package when none is there and the user is root with apt-get", () => {
    expect(planChromium(machine({ isRoot: true, hasAptGet: true }))).toEqual({ install: DEBIAN_CHROMIUM });
  });

  it("otherwise stops with one sentence that says what to install", () => {
    const tests = expectOneSentence(planChromium(machine({ isRoot: false, hasAptGet: true })));
    expect(tests).toMatch(/^npm test needs Chromium, .*sudo apt-get install chromium.*npm test -- --project unit/);
    const shots = expectOneSentence(planChromium(machine({ command: "npm run screenshots" })));
    expect(shots).toMatch(/^npm run screenshots needs Chromium, .*then run npm run screenshots again\.$/);
    expect(expectOneSentence(planChromium(machine({ isRoot: true, hasAptGet: false })))).toContain("set CHROMIUM_PATH");
  });

  it("does not reinstall over a package that is there but broken; it says how to repair it", () => {
    const text = expectOneSentence(planChromium(machine({ present: [DEBIAN_CHROMIUM], isRoot: true })));
    expect(text).toContain("--reinstall chromium");
  });

  it("never depends on a Playwright package that downloads its own browsers", () => {
    const pkg = JSON.parse(readFileSync("package.json", "utf8"));
    const names = Object.keys({ ...pkg.dependencies, ...pkg.devDependencies });
    expect(names.filter((n) => /playwright/.test(n))).toEqual(["playwright-core"]);
  });
});
