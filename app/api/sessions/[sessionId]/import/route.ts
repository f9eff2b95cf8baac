/**
 * POST /api/sessions/[sessionId]/import?mode=preview|commit — multipart with a `file` field
 * (plus format, athleteColumn, testColumn, trialColumn, valueColumn, mapping, matches, replace, remember).
 * Preview checks the file and writes nothing; commit writes all of it or nothing.
 */

import { json, parseId, readCappedBytes, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { runImport } from "@/lib/data/import";
import { ApiError, invalidInput } from "@/lib/errors";
import { MAX_IMPORT_BYTES, MULTIPART_ALLOWANCE_BYTES, TOO_LARGE_MESSAGE } from "@/lib/import/limits";
import { type Multipart, parseMultipart } from "@/lib/import/multipart";
import { importOptionsSchema } from "@/lib/validation/import";

export const POST = withApi<{ sessionId: string }>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });

  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(type)) {
    throw new ApiError(
      415,
      "unsupported_media_type",
      "Send the CSV as multipart/form-data with the file in a field called “file”.",
    );
  }
  const body = await readCappedBytes(request, MAX_IMPORT_BYTES + MULTIPART_ALLOWANCE_BYTES, TOO_LARGE_MESSAGE);
  let form: Multipart;
  try {
    form = parseMultipart(body, type);
  } catch {
    throw new ApiError(
      400,
      "bad_request",
      "The upload is not well-formed multipart/form-data. Choose the file again and retry.",
    );
  }
  const text = (name: string) => form.fields.get(name);

  const file = form.files.get("file");
  if (!file) {
    if (form.fields.has("file"))
      throw invalidInput("The “file” field must be a file upload, not text.", { file: "Not a file." });
    throw invalidInput("Choose a CSV file to import.", { file: "No file was sent (field “file”)." });
  }
  if (file.bytes.length > MAX_IMPORT_BYTES) throw new ApiError(413, "payload_too_large", TOO_LARGE_MESSAGE);

  const url = new URL(request.url);
  const options = importOptionsSchema.parse({
    mode: url.searchParams.get("mode") ?? text("mode"),
    format: text("format") || undefined,
    athleteColumn: text("athleteColumn"),
    testColumn: text("testColumn"),
    trialColumn: text("trialColumn"),
    valueColumn: text("valueColumn"),
    mapping: text("mapping"),
    matches: text("matches"),
    replace: url.searchParams.get("replace") ?? text("replace"),
    remember: text("remember"),
  });
  return json(
    await runImport(actor, sessionId, { bytes: file.bytes, filename: file.filename, contentType: file.type }, options),
  );
});
