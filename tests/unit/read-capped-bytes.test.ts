import { describe, expect, it } from "vitest";
import { readCappedBytes } from "@/lib/api/handler";
import { ApiError } from "@/lib/errors";

/** A streamed body with no Content-Length, as a chunked upload arrives. */
function streamed(chunks: number[]): Request {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      for (const size of chunks) controller.enqueue(new Uint8Array(size).fill(0x61));
      controller.close();
    },
  });
  return new Request("http://test.local/api", { method: "POST", body, duplex: "half" } as RequestInit);
}

const statusOf = (promise: Promise<unknown>) =>
  promise.then(
    () => 200,
    (e) => (e instanceof ApiError ? e.status : 500),
  );

describe("readCappedBytes", () => {
  it("returns the whole body when it fits", async () => {
    expect((await readCappedBytes(streamed([3, 4]), 7, "too large")).byteLength).toBe(7);
  });

  it("stops a streamed body at the limit whatever the headers say", async () => {
    await expect(readCappedBytes(streamed([4, 4]), 7, "Too large for us.")).rejects.toMatchObject({
      status: 413,
      message: "Too large for us.",
    });
  });

  it("refuses a declared Content-Length over the limit before reading", async () => {
    const request = new Request("http://test.local/api", {
      method: "POST",
      body: "x",
      headers: { "content-length": "100" },
    });
    expect(await statusOf(readCappedBytes(request, 10, "too large"))).toBe(413);
  });

  it("reads no body as empty", async () => {
    expect(
      (await readCappedBytes(new Request("http://test.local/api", { method: "POST" }), 10, "too large")).byteLength,
    ).toBe(0);
  });
});
