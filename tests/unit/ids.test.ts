import { describe, expect, it } from "vitest";
import { parseId } from "@/lib/api/handler";
import { canonicalId } from "@/lib/ids";
import { idSchema } from "@/lib/validation/common";

describe("ids in URLs", () => {
  it("reads the canonical spelling of a positive integer", () => {
    expect(canonicalId("6")).toBe(6);
    expect(canonicalId("1234567890")).toBe(1234567890);
    expect(canonicalId(String(Number.MAX_SAFE_INTEGER))).toBe(Number.MAX_SAFE_INTEGER);
  });

  it("refuses every other spelling that Number() would turn into the same record", () => {
    for (const alias of [
      "6.0",
      "6e0",
      "0x6",
      "0b110",
      "0o6",
      " 6",
      "6 ",
      "\t6",
      "+6",
      "06",
      "6.",
      "٦",
      "６",
      "6n",
      "1_0",
    ]) {
      expect(canonicalId(alias), alias).toBeNull();
      expect(() => parseId(alias, "Squad"), alias).toThrow(
        expect.objectContaining({ status: 404, message: "Squad was not found." }),
      );
    }
  });

  it("refuses nothing-ids and ids past the safe integers", () => {
    for (const value of [undefined, null, "", "0", "-6", "Infinity", "NaN", "9007199254740992", "12345678901234567"]) {
      expect(canonicalId(value), String(value)).toBeNull();
    }
  });

  it("ids in JSON bodies are checked by the schema: whole, positive, safe", () => {
    expect(idSchema.safeParse(6).success).toBe(true);
    for (const value of [6.5, 0, -6, "6", 2 ** 53, Number.NaN, Number.POSITIVE_INFINITY])
      expect(idSchema.safeParse(value).success, String(value)).toBe(false);
  });
});
