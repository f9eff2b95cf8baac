/**
 * The Outbox viewer reads back what nodemailer writes. The messages here are built by
 * nodemailer itself (its stream transport), so the reference is the library that sends our mail.
 */
import nodemailer from "nodemailer";
import { describe, expect, it } from "vitest";
import { decodeHeaderWords, quotedPrintableBytes, readEml } from "@/lib/mail/eml";
import { renderMail } from "@/lib/mail/templates";

const build = async (options: Record<string, unknown>) => {
  const transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: "\r\n" });
  const info = await transport.sendMail({ from: "Club <club@example.com>", to: "ava@example.com", ...options });
  return (info.message as Buffer).toString("utf8");
};

describe("readEml", () => {
  it("reads subject, addresses and both parts of a multipart/alternative message", async () => {
    const text = `Héllo — ${"long line ".repeat(30)}\nsecond line`;
    const raw = await build({ subject: "Your new results are in — 14 Sep 2026", text, html: "<p>Hi &amp; bye</p>" });
    const read = readEml(raw);
    expect(read.subject).toBe("Your new results are in — 14 Sep 2026");
    expect(read.from).toBe("Club <club@example.com>");
    expect(read.to).toBe("ava@example.com");
    expect(read.text).toBe(text);
    expect(read.html).toBe("<p>Hi &amp; bye</p>");
    expect(read.date).toMatch(/\d{4}/);
  });

  it("reads base64 parts and a text-only message", async () => {
    expect(readEml(await build({ subject: "s", text: "Ünïcode ✓", textEncoding: "base64" })).text).toBe("Ünïcode ✓");
    const plain = readEml(await build({ subject: "Plain", text: "just text" }));
    expect(plain).toMatchObject({ text: "just text", html: null });
  });

  it("reads a mail with an attachment, skipping the attachment", async () => {
    const raw = await build({
      subject: "With file",
      text: "see file",
      html: "<b>see file</b>",
      attachments: [{ filename: "a.csv", content: "x,y\n1,2" }],
    });
    expect(readEml(raw)).toMatchObject({ text: "see file", html: "<b>see file</b>" });
  });

  it("decodes encoded words (RFC 2047 examples of the B and Q forms)", () => {
    // RFC 2047 §8: "=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=" displays as "ab".
    expect(decodeHeaderWords("=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=")).toBe("ab");
    expect(decodeHeaderWords("=?UTF-8?B?w6k=?=")).toBe("é");
    expect(decodeHeaderWords("plain")).toBe("plain");
  });

  it("decodes quoted-printable soft breaks and escapes (RFC 2045 §6.7)", () => {
    expect(new TextDecoder().decode(quotedPrintableBytes("a=3Db=\r\nc=C3=A9"))).toBe("a=bcé");
  });
});

describe("renderMail", () => {
  it("escapes every value in the HTML part and keeps the text part plain", () => {
    const mail = renderMail({
      kind: "deletion-request",
      data: {
        athleteName: "<script>x</script>",
        organizationName: "A & B",
        message: 'say "hi"',
        link: "http://x/?a=1&b=2",
      },
    });
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).toContain("&lt;script&gt;");
    expect(mail.html).toContain("A &amp; B");
    expect(mail.html).toContain('href="http://x/?a=1&amp;b=2"');
    expect(mail.text).toContain("<script>x</script> asks A & B");
    expect(mail.subject).toBe("Deletion request from <script>x</script>");
  });

  it("puts only the lines it is given in a results mail", () => {
    const mail = renderMail({
      kind: "results-published",
      data: {
        athleteName: "Ava",
        organizationName: "Club",
        sessionLabel: "14 Sep 2026",
        lines: [{ test: "10 m sprint", value: "1.84 s", note: "0.03 s faster" }],
        link: "http://localhost:3000/",
      },
    });
    expect(mail.text).toContain("• 10 m sprint: 1.84 s (0.03 s faster)");
    expect(mail.html).toContain("<li>10 m sprint: 1.84 s (0.03 s faster)</li>");
  });
});
