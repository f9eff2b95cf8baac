import { runToEnd, type Steps } from "./cooperative";

/**
 * Turns the uploaded bytes into text, refusing anything that is not UTF-8 text.
 * A byte-order mark is dropped (Excel writes one in front of "CSV UTF-8" files).
 */
export class ImportFileError extends Error {
  constructor(
    readonly status: 413 | 415 | 422,
    readonly code: "payload_too_large" | "unsupported_media_type" | "invalid_input",
    message: string,
  ) {
    super(message);
    this.name = "ImportFileError";
  }
}

const NOT_TEXT =
  "This file is not a text CSV file (it holds binary data). Export the sheet from your spreadsheet as “CSV UTF-8” and upload that.";
const UTF16 = "This file is UTF-16 text (“Unicode text” in some spreadsheets). Save it as “CSV UTF-8” and upload that.";
const NOT_UTF8 =
  "This file is not UTF-8 text (perhaps an older “CSV” export in a Windows code page). Save it as “CSV UTF-8” and upload that.";

/** Bytes decoded per step: a 10 MB file in one call held the event loop for 40–150 ms. */
const DECODE_CHUNK = 512 * 1024;

export function* decodeSteps(bytes: Uint8Array): Steps<string> {
  if (bytes.length === 0) throw new ImportFileError(422, "invalid_input", "The file is empty.");
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw new ImportFileError(415, "unsupported_media_type", UTF16);
  }
  // NUL never occurs in a text CSV; it marks spreadsheets (xlsx is a zip), images, UTF-16.
  if (bytes.indexOf(0) !== -1) throw new ImportFileError(415, "unsupported_media_type", NOT_TEXT);
  const decoder = new TextDecoder("utf-8", { fatal: true });
  const parts: string[] = [];
  try {
    for (let at = 0; at < bytes.length; at += DECODE_CHUNK) {
      parts.push(decoder.decode(bytes.subarray(at, at + DECODE_CHUNK), { stream: true }));
      yield;
    }
    parts.push(decoder.decode());
  } catch {
    throw new ImportFileError(415, "unsupported_media_type", NOT_UTF8);
  }
  let text = parts.join("");
  yield;
  // TextDecoder drops a leading BOM by default; this guards a BOM left by a double encode.
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (!/\S/.test(text)) throw new ImportFileError(422, "invalid_input", "The file is empty.");
  return text;
}

export const decodeCsvBytes = (bytes: Uint8Array): string => runToEnd(decodeSteps(bytes));
