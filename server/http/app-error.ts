export type ErrorCode =
  | "validation_failed"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "gone"
  | "payload_too_large"
  | "unsupported_media_type"
  | "unprocessable"
  | "rate_limited"
  | "csrf_failed"
  | "unavailable"
  | "internal";

const statusByCode: Record<ErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf_failed: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
};

/** A failure with a message that is safe to show; `details` travels in the body (e.g. a 409's current state). */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.status = statusByCode[code];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} not found.`);

/**
 * A save made against a version someone else has moved on: 409, nothing saved, and the record as it
 * is now in `current`, for the form to show (the board's pattern, shared by every versioned record).
 */
export const staleSave = (what: string, current: unknown) =>
  new AppError("conflict", `Someone else changed this ${what} a moment ago. You now see their version; make your change again if it still applies.`, undefined, { current });
