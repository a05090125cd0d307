import type { ErrorRequestHandler, RequestHandler } from "express";
import { AppError } from "./app-error";

/** Errors thrown by body-parser and friends carry `type` and `status`; map them to our shape. */
function fromFramework(error: unknown): AppError | null {
  if (typeof error !== "object" || error === null) return null;
  const { type, status } = error as { type?: string; status?: number };
  if (type === "entity.too.large" || status === 413) return new AppError("payload_too_large", "The request body is too large.");
  if (type === "entity.parse.failed") return new AppError("validation_failed", "The request body is not valid JSON.");
  if (type === "charset.unsupported" || type === "encoding.unsupported" || status === 415)
    return new AppError("unsupported_media_type", "That content encoding is not supported.");
  return null;
}

const MAX_CAUSES = 5;

/** The driver's error, or drizzle's wrapping of it (its `cause`). */
function isDatabaseDown(error: unknown, depth = 0): boolean {
  const code = (error as { code?: string })?.code ?? "";
  const message = (error as Error)?.message ?? "";
  const down = ["ECONNREFUSED", "57P01", "57P03", "08006", "08001", "ECONNRESET"].includes(code) || /Connection terminated|timeout exceeded when trying to connect|Cannot use a pool after calling end/i.test(message);
  // One or two causes deep in practice; a chain that loops back on itself is not followed for ever.
  const cause = (error as { cause?: unknown })?.cause;
  return down || (cause !== undefined && depth < MAX_CAUSES && isDatabaseDown(cause, depth + 1));
}

export const errorMiddleware: ErrorRequestHandler = (error, _req, res, _next) => {
  const known = error instanceof AppError ? error : fromFramework(error);
  if (known) {
    // A refusal that knows when to come back says so in HTTP's own header too (RFC 9110, 10.2.3).
    const retryAfter = known.details?.retryAfterSeconds;
    if (typeof retryAfter === "number") res.set("Retry-After", String(retryAfter));
    res.status(known.status).json({
      error: { code: known.code, message: known.message, ...(known.fields ? { fields: known.fields } : {}) },
      ...known.details,
    });
    return;
  }
  if (isDatabaseDown(error)) {
    res.status(503).json({ error: { code: "unavailable", message: "The database is not reachable; try again in a moment." } });
    return;
  }
  console.error("[http] unexpected error", error);
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on our side." } });
};

export const apiNotFound: RequestHandler = (_req, _res, next) => {
  next(new AppError("not_found", "No such API route."));
};
