/**
 * Errors in the provider's shape: `{ "error": { "type", "code", "message", "param" } }`, with its
 * status codes (400 bad request, 401 key, 404 no such object). `code` and `param` are left out when
 * the provider leaves them out. The SDK turns 400/404 into StripeInvalidRequestError (or
 * StripeIdempotencyError for type idempotency_error) and 401 into StripeAuthenticationError.
 *
 * Messages follow the provider's wording where it is known: from its API reference, from public
 * records of its answers, or from memory where a comment says so.
 */
export type ErrorType = "invalid_request_error" | "idempotency_error" | "api_error";

interface ErrorDetails {
  type?: ErrorType;
  code?: string;
  param?: string;
  /**
   * Parameter validation failed before the endpoint began its work. The provider saves no
   * idempotent result for such answers, so a retry with the same key is evaluated afresh.
   */
  validation?: boolean;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details: ErrorDetails = {},
  ) {
    super(message);
  }

  get savedForIdempotency(): boolean {
    return !this.details.validation && this.status !== 401;
  }

  body() {
    const { type = "invalid_request_error", code, param } = this.details;
    return { error: { type, message: this.message, ...(code ? { code } : {}), ...(param ? { param } : {}) } };
  }
}

export const missingParam = (param: string) =>
  new ApiError(400, `Missing required param: ${param}.`, { code: "parameter_missing", param, validation: true });

export const unknownParam = (param: string) =>
  new ApiError(400, `Received unknown parameter: ${param}`, { code: "parameter_unknown", param, validation: true });

export const invalidParam = (param: string, message: string, code?: string) => new ApiError(400, message, { param, code, validation: true });

/** A request refused as a whole, with neither code nor param (as the provider answers some of them). */
export const invalidRequest = (message: string) => new ApiError(400, message, { validation: true });

/** 404 for the object a URL names; 400 when a parameter names an object that does not exist. */
export const noSuch = (kind: string, id: string, param = "id", status = 404) =>
  new ApiError(status, `No such ${kind}: '${id}'`, { code: "resource_missing", param });

/** A request the object's state refuses (a draft voided, a paid invoice paid again). */
export const stateRefusal = (message: string, details: { code?: string; param?: string } = {}) => new ApiError(400, message, details);
