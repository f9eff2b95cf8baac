/**
 * POST /api/sessions/[sessionId]/import?mode=preview|commit — multipart with a `file` field
 * (plus format, athleteColumn, testColumn, trialColumn, valueColumn, mapping, replace).
 * Preview checks the file and writes nothing; commit writes all of it or nothing.
 */
import { ApiError, invalidInput } from "@/lib/errors";
import { json, parseId, readCappedBytes, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { runImport } from "@/lib/data/import";
import { MAX_IMPORT_BYTES, MULTIPART_ALLOWANCE_BYTES, TOO_LARGE_MESSAGE } from "@/lib/import/limits";
import { importOptionsSchema } from "@/lib/validation/import";

const text = (value: FormDataEntryValue | null) => (typeof value === "string" ? value : undefined);

export const POST = withApi<{ sessionId: string }>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });

  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(type)) {
    throw new ApiError(415, "unsupported_media_type", "Send the CSV as multipart/form-data with the file in a field called “file”.");
  }
  const body = await readCappedBytes(request, MAX_IMPORT_BYTES + MULTIPART_ALLOWANCE_BYTES, TOO_LARGE_MESSAGE);
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { "content-type": type } }).formData();
  } catch {
    throw new ApiError(400, "bad_request", "The upload is not well-formed multipart/form-data. Choose the file again and retry.");
  }

  const file = form.get("file");
  if (file === null) throw invalidInput("Choose a CSV file to import.", { file: "No file was sent (field “file”)." });
  if (typeof file === "string") throw invalidInput("The “file” field must be a file upload, not text.", { file: "Not a file." });
  if (file.size > MAX_IMPORT_BYTES) throw new ApiError(413, "payload_too_large", TOO_LARGE_MESSAGE);

  const url = new URL(request.url);
  const options = importOptionsSchema.parse({
    mode: url.searchParams.get("mode") ?? text(form.get("mode")),
    format: text(form.get("format")) || undefined,
    athleteColumn: text(form.get("athleteColumn")),
    testColumn: text(form.get("testColumn")),
    trialColumn: text(form.get("trialColumn")),
    valueColumn: text(form.get("valueColumn")),
    mapping: text(form.get("mapping")),
    replace: url.searchParams.get("replace") ?? text(form.get("replace")),
  });
  const bytes = new Uint8Array(await file.arrayBuffer());
  return json(await runImport(actor, sessionId, { bytes, filename: file.name, contentType: file.type || null }, options));
});
