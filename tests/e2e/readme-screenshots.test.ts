/**
 * `npm run screenshots` run as the README names it, into tests/.artifacts/readme/ instead of
 * docs/screenshots/. It serves its own production server on its own fresh demo database (it
 * publishes a session there, which the database the other browser tests share must not see), and
 * it must leave every picture the README shows, each at its width and small enough to commit.
 */
import { spawnSync } from "node:child_process";
import { readdirSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ARTIFACTS } from "../helpers/browser";

describe("npm run screenshots", () => {
  it("takes every picture the README shows", { timeout: 240_000 }, () => {
    const out = join(ARTIFACTS, "readme");
    rmSync(out, { recursive: true, force: true });
    const run = spawnSync("npm", ["run", "screenshots", "--", out], { encoding: "utf8", timeout: 230_000 });
    expect(run.status, `${run.stdout}\n${run.stderr}`).toBe(0);

    expect(readdirSync(out).sort()).toEqual(readdirSync("docs/screenshots").sort());
    for (const name of readdirSync(out)) {
      const png = readFileSync(join(out, name));
      const width = png.readUInt32BE(16);
      expect(width, name).toBe(name.endsWith("-phone.png") ? 390 : 1280);
      expect(png.length, name).toBeLessThan(400 * 1024);
    }
  });
});
