import { describe, expect, it } from "vitest";
import { cleanText, optionalText, requiredText } from "@/lib/validation/common";
import { squadCreateSchema } from "@/lib/validation/roster";
import { sessionCreateSchema } from "@/lib/validation/sessions";

const name = requiredText(80, "Name");
const position = optionalText(60, "Position");

describe("required text", () => {
  it("refuses text with nothing visible in it", () => {
    for (const value of [
      "",
      "\u0000",
      "\u200b",
      "\u202e",
      "\u2066\u2069",
      " \t\r\n ",
      "\ufeff",
      "\u200b\u200d\u200b",
      "\u3164",
      "\u2800",
      "\u0085\u00a0",
      "\u0301",
    ]) {
      const parsed = name.safeParse(value);
      expect(parsed.success, JSON.stringify(value)).toBe(false);
    }
  });

  it("strips controls and bidi overrides anywhere, invisible characters at the ends", () => {
    expect(name.parse("\u202eAnna Kovac\u200b")).toBe("Anna Kovac");
    expect(name.parse("An\u0000na\u0007")).toBe("Anna");
    expect(name.parse("Anna\u202e Kovac")).toBe("Anna Kovac");
    expect(name.parse("Anna\nKovac")).toBe("Anna Kovac");
    expect(name.parse("\ufeff\u200e Anna \u200f")).toBe("Anna");
  });

  it("keeps what real names need: letters of any script, joiners inside a word", () => {
    expect(name.parse("Zoë O'Neill-Ørsted")).toBe("Zoë O'Neill-Ørsted");
    expect(name.parse("مريم")).toBe("مريم");
    expect(name.parse("می\u200cخواهم")).toBe("می\u200cخواهم");
  });

  it("stores formula-like text as typed: it is neutralised only when written to CSV", () => {
    expect(name.parse('=HYPERLINK("http://x.example","y")')).toBe('=HYPERLINK("http://x.example","y")');
    expect(name.parse("-1")).toBe("-1");
  });

  it("counts the limit after cleaning", () => {
    expect(requiredText(3, "Code").parse("\u200bABC\u200b")).toBe("ABC");
    expect(requiredText(3, "Code").safeParse("ABCD").success).toBe(false);
  });
});

describe("optional text", () => {
  it("turns empty or only-invisible text into null", () => {
    for (const value of [undefined, null, "", "  ", "\u200b", "\u202e\u0000"])
      expect(position.parse(value), JSON.stringify(value)).toBeNull();
  });

  it("refuses text that draws nothing on its own rather than storing it", () => {
    expect(position.parse("\u3164")).toBeNull();
    expect(position.safeParse("\u0301\u0301").success).toBe(false);
  });

  it("keeps line breaks in notes (normalised to \\n) and nowhere else", () => {
    expect(cleanText("a\r\nb\rc\u2028d", { multiline: true })).toBe("a\nb\nc\nd");
    expect(cleanText("a\r\nb")).toBe("a b");
  });
});

describe("every form and route shares the rule", () => {
  it("squads and sessions use it", () => {
    expect(squadCreateSchema.safeParse({ name: "\u200b" }).success).toBe(false);
    const session = sessionCreateSchema.parse({
      squadId: 1,
      date: "2026-09-14",
      phase: "retest",
      testIds: [1],
      notes: "Wet track.\r\n\u202eWind 2 m/s\u0000",
    });
    expect(session.notes).toBe("Wet track.\nWind 2 m/s");
  });
});
