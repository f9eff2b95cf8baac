/**
 * The browser the browser tests, the screenshots and the page benchmarks drive: Debian's
 * Chromium through playwright-core. Playwright's own browser download is never used, so on a
 * fresh machine `npm test` finds Chromium, installs Debian's package itself where it may, or
 * stops with one sentence that says what to install — before any test runs, instead of every
 * browser test failing on its own launch.
 */
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";

export const DEBIAN_CHROMIUM = "/usr/bin/chromium";

/** Where the browser is looked for: `CHROMIUM_PATH` when set, else Debian's package. */
export const chromiumPath = (env: NodeJS.ProcessEnv = process.env) => env.CHROMIUM_PATH || DEBIAN_CHROMIUM;

export type ChromiumProbe = {
  /** The command that needs the browser, named in what a person reads: "npm test". */
  command: string;
  chosen: string | undefined;
  /** The binary is there and `--version` answers. */
  starts: (path: string) => boolean;
  exists: (path: string) => boolean;
  isRoot: boolean;
  hasAptGet: boolean;
};

export type ChromiumPlan = { use: string } | { install: string } | { stop: string };

/** What to do about the browser, decided from what the machine has. Pure, so each case is tested. */
export function planChromium({ command, chosen, starts, exists, isRoot, hasAptGet }: ChromiumProbe): ChromiumPlan {
  if (chosen) {
    if (starts(chosen)) return { use: chosen };
    // An explicit choice that does not work is a mistake to report, not one to paper over with another browser.
    return {
      stop: `CHROMIUM_PATH is set to ${chosen}, but no Chromium starts from there: point it at a Chromium binary, or unset it to use Debian's chromium package at ${DEBIAN_CHROMIUM}.`,
    };
  }
  if (starts(DEBIAN_CHROMIUM)) return { use: DEBIAN_CHROMIUM };
  if (exists(DEBIAN_CHROMIUM)) {
    return {
      stop: `${DEBIAN_CHROMIUM} is installed but does not start (\`${DEBIAN_CHROMIUM} --version\` fails): repair it with \`apt-get install --reinstall chromium\`, or set CHROMIUM_PATH to another Chromium binary.`,
    };
  }
  if (isRoot && hasAptGet) return { install: DEBIAN_CHROMIUM };
  const how = hasAptGet
    ? "install Debian's chromium package (`sudo apt-get install chromium`)"
    : "install Chromium with your system's package manager and set CHROMIUM_PATH to its binary";
  const without =
    command === "npm test" ? " (`npm test -- --project unit` runs the other tests without a browser)" : "";
  return {
    stop: `${command} needs Chromium, which is not at ${DEBIAN_CHROMIUM}: ${how}, then run ${command} again${without}.`,
  };
}

function starts(path: string): boolean {
  if (!existsSync(path)) return false;
  const run = spawnSync(path, ["--version"], { stdio: "ignore", timeout: 30_000 });
  return run.status === 0;
}

const hasAptGet = () => spawnSync("apt-get", ["--version"], { stdio: "ignore" }).status === 0;

/** Thrown with a sentence meant for a person; callers print its message alone, with no stack. */
export class ChromiumUnavailable extends Error {}

function aptGet(args: string[]) {
  const run = spawnSync("apt-get", args, {
    // Progress goes straight to the terminal; apt-get must never wait for an answer.
    stdio: ["ignore", "inherit", "inherit"],
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  return run.status ?? 1;
}

/** Installs Debian's chromium package, saying so and letting apt-get show its progress. */
function installChromium(command: string, log: (line: string) => void) {
  log(
    `\n▸ Chromium is not installed, and ${command} needs it: installing Debian's chromium package with apt-get (once; about 100 MB to download).\n`,
  );
  const started = Date.now();
  // Wait a little for another apt run (an unattended upgrade) instead of failing on its lock.
  const lock = ["-o", "DPkg::Lock::Timeout=120"];
  const update = aptGet([...lock, "update"]);
  // Recommends would add about a hundred packages (systemd, avahi, cups tools, perl) that a headless
  // browser does not use, and upgrade others on the way: the browser alone is 25 packages.
  const install = update === 0 ? aptGet([...lock, "install", "-y", "--no-install-recommends", "chromium"]) : update;
  if (install !== 0 || !starts(DEBIAN_CHROMIUM)) {
    throw new ChromiumUnavailable(
      `Installing Debian's chromium package failed (apt-get exited with ${install}, see above): install it by hand with \`apt-get install chromium\`, or set CHROMIUM_PATH to a Chromium binary, then run ${command} again.`,
    );
  }
  log(`\n▸ Chromium installed in ${Math.round((Date.now() - started) / 1000)} s.\n`);
}

/** The path of a Chromium that starts, installing Debian's package first when that is allowed. */
export function ensureChromium(command: string, log: (line: string) => void = console.log): string {
  const plan = planChromium({
    command,
    chosen: process.env.CHROMIUM_PATH,
    starts,
    exists: existsSync,
    isRoot: process.getuid?.() === 0,
    hasAptGet: hasAptGet(),
  });
  if ("stop" in plan) throw new ChromiumUnavailable(plan.stop);
  if ("install" in plan) installChromium(command, log);
  return "use" in plan ? plan.use : plan.install;
}
