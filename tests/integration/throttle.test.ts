import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { setupTestDatabase } from "../helpers/db";

const { authorizeCredentials, SignInError } = await import("@/lib/auth/credentials");
const { MAX_FAILURES_PER_ADDRESS, MAX_FAILURES_PER_EMAIL, THROTTLED_MESSAGE } = await import("@/lib/auth/throttle");
const { authOptions } = await import("@/lib/auth/options");

const SPRAY = ["spray-1@example.com", "spray-2@example.com", "spray-3@example.com", "spray-4@example.com"];
const SPREAD = ["spread-1@example.com", "spread-2@example.com", "spread-3@example.com", "spread-4@example.com"];

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
beforeAll(async () => {
  env = await setupTestDatabase();
  // Accounts for spraying wrong passwords; a cheap hash keeps the test fast (unknown e-mails are
  // checked against a full-cost one).
  const passwordHash = await hashPassword("not-guessed", 4);
  await env.db.insert(users).values([...SPRAY, ...SPREAD].map((email) => ({ email, name: email, passwordHash })));
});
afterAll(() => env.cleanup());
afterEach(() => {
  delete process.env.TRUST_PROXY;
});

type Authorize = (
  credentials: Record<string, string>,
  request: { headers: Record<string, string> },
) => Promise<unknown>;
/** The authorize next-auth calls, with the request headers it hands over. */
const authorizeOverHttp = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options
  .authorize;

/** "checked" when the password was checked, "held" when throttled before that. */
async function outcome(attempt: Promise<unknown>): Promise<"signed-in" | "checked" | "held"> {
  try {
    return (await attempt) ? "signed-in" : "checked";
  } catch (error) {
    if (error instanceof SignInError) return "held";
    throw error;
  }
}

describe("sign-in throttling", () => {
  it("accepts the right password and refuses a wrong one", async () => {
    expect(
      await authorizeCredentials({ email: "coach@example.com", password: "changewise-demo" }, "10.0.0.1"),
    ).toMatchObject({ email: "coach@example.com" });
    expect(await authorizeCredentials({ email: "coach@example.com", password: "nope" }, "10.0.0.1")).toBeNull();
    expect(await authorizeCredentials({ email: "nobody@example.com", password: "x" }, "10.0.0.1")).toBeNull();
    expect(await authorizeCredentials({ email: "not an email" }, "10.0.0.1")).toBeNull();
  });

  it("after five failures in a minute an account is held for the addresses that failed on it, not for others", async () => {
    expect(MAX_FAILURES_PER_EMAIL).toBe(5);
    const email = "scientist@example.com";
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) {
      expect(await authorizeCredentials({ email, password: `wrong-${i}` }, `192.0.2.${i}`)).toBeNull();
    }
    // An address that failed on the account is held, even with the right password...
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.0")).rejects.toThrow(
      THROTTLED_MESSAGE,
    );
    // ...but the member at an address that has not been failing still gets in: nobody can lock
    // them out with five wrong passwords from elsewhere.
    expect(await authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.200")).toMatchObject({ email });
    // A fresh address gets one try while the account is under attack, not a fresh allowance.
    expect(await authorizeCredentials({ email, password: "guess" }, "192.0.2.201")).toBeNull();
    await expect(authorizeCredentials({ email, password: "changewise-demo" }, "192.0.2.201")).rejects.toThrow(
      THROTTLED_MESSAGE,
    );
  });

  it("when the address is unknown (no trusted proxy), a held account is held for every caller", async () => {
    const email = "athlete@example.com";
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) {
      expect(
        await authorizeOverHttp({ email, password: `wrong-${i}` }, { headers: { "x-forwarded-for": `198.18.0.${i}` } }),
      ).toBeNull();
    }
    // A made-up X-Forwarded-For is not a clean address.
    await expect(
      authorizeOverHttp({ email, password: "changewise-demo" }, { headers: { "x-forwarded-for": "198.18.9.9" } }),
    ).rejects.toThrow(THROTTLED_MESSAGE);
    await expect(authorizeOverHttp({ email, password: "changewise-demo" }, { headers: {} })).rejects.toThrow(
      THROTTLED_MESSAGE,
    );
  });

  it("a parallel burst checks no more passwords than the limit", async () => {
    const email = "owner@other.example.com";
    const burst = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        outcome(authorizeCredentials({ email, password: `burst-${i}` }, "192.0.2.50")),
      ),
    );
    expect(burst.filter((o) => o === "checked")).toHaveLength(MAX_FAILURES_PER_EMAIL);
    expect(burst.filter((o) => o === "held")).toHaveLength(12 - MAX_FAILURES_PER_EMAIL);
  });

  it("behind a declared proxy, the address is the one the proxy saw, whatever the client puts in front", async () => {
    process.env.TRUST_PROXY = "1";
    const accounts = SPRAY;
    // Each attempt claims a new address at the left; the proxy appends the real one at the right.
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) {
      const headers = { "x-forwarded-for": `10.9.${i}.1, 203.0.113.9` };
      expect(
        await authorizeOverHttp({ email: accounts[i % accounts.length], password: "spray" }, { headers }),
      ).toBeNull();
    }
    const rotated = { "x-forwarded-for": "10.9.99.1, 203.0.113.9" };
    await expect(
      authorizeOverHttp({ email: "coach@example.com", password: "changewise-demo" }, { headers: rotated }),
    ).rejects.toThrow(THROTTLED_MESSAGE);
    // Another real address is unaffected.
    const other = { "x-forwarded-for": "10.9.99.1, 203.0.113.10" };
    expect(
      await authorizeOverHttp({ email: "coach@example.com", password: "changewise-demo" }, { headers: other }),
    ).not.toBeNull();
  });

  it("blocks an address that tries many e-mails, but not after a few typos from a shared address", async () => {
    const address = "198.51.100.7";
    // Wrong passwords spread over accounts, none passing its own limit, so only the address
    // count can hold the last attempt.
    const accounts = SPREAD;
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS - 1; i++) {
      expect(
        await authorizeCredentials({ email: accounts[i % accounts.length], password: "typo" }, address),
      ).toBeNull();
    }
    expect(
      await authorizeCredentials({ email: "owner@example.com", password: "changewise-demo" }, address),
    ).not.toBeNull();
    expect(await authorizeCredentials({ email: "owner@example.com", password: "typo" }, address)).toBeNull();
    await expect(
      authorizeCredentials({ email: "owner@example.com", password: "changewise-demo" }, address),
    ).rejects.toThrow(THROTTLED_MESSAGE);
    // Another address is unaffected.
    expect(
      await authorizeCredentials({ email: "owner@example.com", password: "changewise-demo" }, "198.51.100.8"),
    ).not.toBeNull();
  });
});
