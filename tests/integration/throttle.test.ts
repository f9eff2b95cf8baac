import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { setupTestDatabase } from "../helpers/db";

const { authorizeCredentials, SignInError } = await import("@/lib/auth/credentials");
const { MAX_FAILURES_PER_WINDOW, THROTTLED_MESSAGE } = await import("@/lib/auth/throttle");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
beforeAll(async () => {
  env = await setupTestDatabase();
});
afterAll(() => env.cleanup());

describe("sign-in throttling", () => {
  it("accepts the right password and refuses a wrong one", async () => {
    expect(await authorizeCredentials({ email: "coach@example.com", password: "changewise-demo" }, "10.0.0.1")).toMatchObject({ email: "coach@example.com" });
    expect(await authorizeCredentials({ email: "coach@example.com", password: "nope" }, "10.0.0.1")).toBeNull();
    expect(await authorizeCredentials({ email: "nobody@example.com", password: "x" }, "10.0.0.1")).toBeNull();
    expect(await authorizeCredentials({ email: "not an email" }, "10.0.0.1")).toBeNull();
  });

  it("blocks an e-mail after five failures in a minute, even with the right password", async () => {
    const email = "scientist@example.com";
    for (let i = 0; i < MAX_FAILURES_PER_WINDOW; i++) {
      expect(await authorizeCredentials({ email, password: `wrong-${i}` }, `192.0.2.${i}`)).toBeNull();
    }
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.200")).rejects.toThrow(SignInError);
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.200")).rejects.toThrow(THROTTLED_MESSAGE);
  });

  it("blocks an address that tries many e-mails", async () => {
    const address = "198.51.100.7";
    for (let i = 0; i < MAX_FAILURES_PER_WINDOW; i++) {
      await authorizeCredentials({ email: `guess${i}@example.com`, password: "x" }, address);
    }
    await expect(authorizeCredentials({ email: "owner@example.com", password: "changewise-demo" }, address)).rejects.toThrow(THROTTLED_MESSAGE);
    // Another address is unaffected.
    expect(await authorizeCredentials({ email: "owner@example.com", password: "changewise-demo" }, "198.51.100.8")).not.toBeNull();
  });
});
