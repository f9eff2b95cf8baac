import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { setupTestDatabase } from "../helpers/db";

const { authorizeCredentials, SignInError } = await import("@/lib/auth/credentials");
const { MAX_FAILURES_PER_ADDRESS, MAX_FAILURES_PER_EMAIL, THROTTLED_MESSAGE } = await import("@/lib/auth/throttle");

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
    expect(MAX_FAILURES_PER_EMAIL).toBe(5);
    const email = "scientist@example.com";
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) {
      expect(await authorizeCredentials({ email, password: `wrong-${i}` }, `192.0.2.${i}`)).toBeNull();
    }
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.200")).rejects.toThrow(SignInError);
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.200")).rejects.toThrow(THROTTLED_MESSAGE);
  });

  it("blocks an address that tries many e-mails, but not after a few typos from a shared address", async () => {
    const address = "198.51.100.7";
    // Wrong passwords spread over accounts (seeded ones hash cheaply), none passing its own
    // limit, so only the address count can hold the last attempt.
    const accounts = ["owner@example.com", "athlete@example.com", "owner@other.example.com", "nobody@example.com"];
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS - 1; i++) {
      expect(await authorizeCredentials({ email: accounts[i % accounts.length], password: "typo" }, address)).toBeNull();
    }
    expect(await authorizeCredentials({ email: "coach@example.com", password: "changewise-demo" }, address)).not.toBeNull();
    expect(await authorizeCredentials({ email: "coach@example.com", password: "typo" }, address)).toBeNull();
    await expect(authorizeCredentials({ email: "coach@example.com", password: "changewise-demo" }, address)).rejects.toThrow(THROTTLED_MESSAGE);
    // Another address is unaffected.
    expect(await authorizeCredentials({ email: "coach@example.com", password: "changewise-demo" }, "198.51.100.8")).not.toBeNull();
  });
});
