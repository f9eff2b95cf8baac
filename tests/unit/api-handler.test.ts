import { afterEach, describe, expect, it, vi } from "vitest";
import { withApi } from "@/lib/api/handler";
import { ApiError } from "@/lib/errors";

const request = () => new Request("http://test.local/api/x", { method: "POST" });
const context = { params: Promise.resolve({}) };

async function answer(thrown: unknown) {
  const response = await withApi(async () => {
    throw thrown;
  })(request(), context);
  return { status: response.status, body: await response.text() };
}

afterEach(() => vi.restoreAllMocks());

describe("withApi cannot fail", () => {
  it("answers a fixed 500 JSON body when the error response itself cannot be built", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    // JSON cannot hold a BigInt: building this error's body throws, as a too-long error list does.
    const { status, body } = await answer(new ApiError(422, "invalid_input", "Bad file.", { details: { count: 10n } }));
    expect(status).toBe(500);
    expect(JSON.parse(body)).toEqual({
      error: { code: "internal", message: expect.stringMatching(/Nothing was changed/) },
    });
    expect(log).toHaveBeenCalled();
  });

  it("still answers when the thrown value breaks every inspection and logging throws too", async () => {
    vi.spyOn(console, "error").mockImplementation(() => {
      throw new Error("log sink down");
    });
    const hostile = new Proxy(
      {},
      {
        get() {
          throw new Error("no property");
        },
        getPrototypeOf() {
          throw new Error("no prototype");
        },
      },
    );
    const { status, body } = await answer(hostile);
    expect(status).toBe(500);
    expect(JSON.parse(body).error.code).toBe("internal");
  });

  it("keeps ordinary API errors as they were", async () => {
    const { status, body } = await answer(new ApiError(409, "conflict", "Changed since."));
    expect(status).toBe(409);
    expect(JSON.parse(body)).toEqual({ error: { code: "conflict", message: "Changed since." } });
  });
});
