/**
 * One error shape for every API answer: `{ error: { code, message, fields?, rows? } }`.
 * Thrown anywhere below a route handler; `withApi` turns it into the response.
 */
export type ErrorCode =
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "method_not_allowed"
  | "conflict"
  | "gone"
  | "invalid_input"
  | "payload_too_large"
  | "unsupported_media_type"
  | "too_many_requests"
  | "bad_request"
  | "internal";

export type FieldErrors = Record<string, string>;
/**
 * A problem in one row of the input: an index into a batch of results, or in a file the
 * spreadsheet row (the header is row 1) with the column header.
 */
export type RowError = { row: number; column?: string; message: string };

export type ErrorBody = {
  error: { code: ErrorCode; message: string; fields?: FieldErrors; rows?: RowError[]; details?: unknown };
};

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly extra: { fields?: FieldErrors; rows?: RowError[]; details?: unknown } = {},
  ) {
    super(message);
    this.name = "ApiError";
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...this.extra } };
  }
}

export const unauthenticated = () => new ApiError(401, "unauthenticated", "Sign in to continue.");
export const forbidden = (message = "Your role does not allow this.") => new ApiError(403, "forbidden", message);
// Anything outside the caller's reach is "not found", so its existence is never revealed.
export const notFound = (what = "That record") => new ApiError(404, "not_found", `${what} was not found.`);
export const conflict = (message: string, details?: unknown) => new ApiError(409, "conflict", message, { details });
export const invalidInput = (message: string, fields?: FieldErrors, rows?: RowError[]) =>
  new ApiError(422, "invalid_input", message, { fields, rows });
