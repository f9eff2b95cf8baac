/** A client that gives up halfway through sending a body is a client problem: 400, and no error log. */
import { afterEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { json, readCappedBytes, readJson, withApi } from "@/lib/api/handler";

/** A JSON body whose connection drops after the first chunk, as Node reports an aborted upload. */
function interrupted(): Request {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(new TextEncoder().encode('{"name":"Half'));
      setTimeout(() => controller.error(Object.assign(new Error("aborted"), { code: "ECONNRESET" })), 5);
    },
  });
  return new Request("http://test.local/api/squads", {
    method: "POST",
    body,
    duplex: "half",
    headers: { "content-type": "application/json" },
  } as RequestInit);
}

afterEach(() => vi.restoreAllMocks());

describe("an interrupted body", () => {
  it("answers 400 from readJson and logs nothing", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const handler = withApi(async (request) => json(await readJson(request, z.object({ name: z.string() }))));
    const response = await handler(interrupted(), { params: Promise.resolve({}) });
    expect(response.status).toBe(400);
    expect((await response.json()).error).toMatchObject({
      code: "bad_request",
      message: expect.stringContaining("interrupted"),
    });
    expect(log).not.toHaveBeenCalled();
  });

  it("answers 400 from the upload reader too", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const handler = withApi(async (request) =>
      json({ size: (await readCappedBytes(request, 1024, "too large")).byteLength }),
    );
    expect((await handler(interrupted(), { params: Promise.resolve({}) })).status).toBe(400);
    expect(log).not.toHaveBeenCalled();
  });
});
