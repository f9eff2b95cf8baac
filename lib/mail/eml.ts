/**
 * Reads back a message the local mail fake stored (RFC 5322 with MIME, as nodemailer writes it)
 * for the Outbox page: the headers a reader needs, and the plain-text and HTML parts decoded.
 * Enough MIME for what nodemailer sends (multipart nesting, quoted-printable, base64, encoded
 * words); it is a viewer for our own mail, not a general mail parser.
 */

export type ReadMessage = {
  from: string;
  to: string;
  subject: string;
  date: string;
  text: string | null;
  html: string | null;
};

type Part = { headers: Map<string, string>; body: string };

function splitPart(raw: string): Part {
  const end = raw.search(/\r?\n\r?\n/);
  const head = end === -1 ? raw : raw.slice(0, end);
  const body = end === -1 ? "" : raw.slice(end).replace(/^\r?\n\r?\n/, "");
  const headers = new Map<string, string>();
  // Folded lines continue the header above them (RFC 5322 §2.2.3).
  for (const line of head.replace(/\r?\n[ \t]+/g, " ").split(/\r?\n/)) {
    const colon = line.indexOf(":");
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

const param = (header: string | undefined, name: string) =>
  header?.match(new RegExp(`${name}="?([^";]+)"?`, "i"))?.[1] ?? null;

const decodeBytes = (bytes: Uint8Array, charset: string | null) => {
  try {
    return new TextDecoder(charset ?? "utf-8").decode(bytes);
  } catch {
    return new TextDecoder("utf-8").decode(bytes);
  }
};

/** Quoted-printable (RFC 2045 §6.7) to bytes: soft line breaks removed, =XX decoded. */
export function quotedPrintableBytes(text: string): Uint8Array {
  const joined = text.replace(/=\r?\n/g, "");
  const out: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      out.push(Number.parseInt(hex, 16));
      i += 2;
    } else out.push(...new TextEncoder().encode(joined[i]));
  }
  return Uint8Array.from(out);
}

function decodeBody(part: Part): string {
  const encoding = part.headers.get("content-transfer-encoding")?.toLowerCase() ?? "7bit";
  const charset = param(part.headers.get("content-type"), "charset");
  if (encoding === "base64") return decodeBytes(Buffer.from(part.body.replace(/\s+/g, ""), "base64"), charset);
  if (encoding === "quoted-printable") return decodeBytes(quotedPrintableBytes(part.body), charset);
  return part.body.replace(/\r\n/g, "\n");
}

/** Decodes RFC 2047 encoded words, e.g. "=?UTF-8?Q?Hi_=C3=A9?=" → "Hi é". */
export function decodeHeaderWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, "?==?")
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_, charset: string, kind: string, data: string) =>
      kind.toUpperCase() === "B"
        ? decodeBytes(Buffer.from(data, "base64"), charset)
        : decodeBytes(quotedPrintableBytes(data.replaceAll("_", " ")), charset),
    );
}

function leaves(part: Part, found: { text: string | null; html: string | null }) {
  const type = part.headers.get("content-type") ?? "text/plain";
  const boundary = param(type, "boundary");
  if (/^multipart\//i.test(type) && boundary) {
    const sections = part.body.split(`--${boundary}`);
    // Between the preamble and the closing "--boundary--" lie the parts.
    for (const section of sections.slice(1)) {
      if (section.startsWith("--")) break;
      leaves(splitPart(section.replace(/^\r?\n/, "")), found);
    }
    return;
  }
  if (/^text\/plain/i.test(type) && found.text === null) found.text = decodeBody(part).replace(/\r?\n$/, "");
  if (/^text\/html/i.test(type) && found.html === null) found.html = decodeBody(part).replace(/\r?\n$/, "");
}

/** Reads a stored message. */
export function readEml(raw: string): ReadMessage {
  const message = splitPart(raw);
  const header = (name: string) => decodeHeaderWords(message.headers.get(name) ?? "");
  const found = { text: null as string | null, html: null as string | null };
  leaves(message, found);
  return { from: header("from"), to: header("to"), subject: header("subject"), date: header("date"), ...found };
}
