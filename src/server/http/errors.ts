import "server-only";
import { randomUUID } from "node:crypto";
import { ZodError } from "zod";

export const errorStatus = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

/** An expected failure with its §9 code; the route wrappers turn it into `{ error: { code, message, details } }`. */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details: unknown = null,
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
  }
}

export function errorResponse(code: ErrorCode, message: string, details: unknown = null, headers: Record<string, string> = {}): Response {
  return Response.json({ error: { code, message, details } }, { status: errorStatus[code], headers });
}

/** Maps anything thrown by a handler to the §9 error shape; unknown errors are logged and never leak. */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof AppError) return errorResponse(error.code, error.message, error.details, error.headers);
  if (error instanceof ZodError) {
    const details = error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
    const first = details[0];
    return errorResponse("unprocessable", first ? `${first.path || "input"}: ${first.message}` : "Invalid input", details);
  }
  const requestId = randomUUID();
  console.error(`[${requestId}]`, error);
  return errorResponse("internal", `Something went wrong on our side (request ${requestId}).`, { requestId });
}
