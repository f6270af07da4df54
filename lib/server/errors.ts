import { jsonResponse } from "@/lib/server/json-response";
import "server-only";
import { log } from "./log";

export type FieldErrors = Record<string, string[]>;

/** The one family of errors the app raises on purpose; each knows its HTTP status and API code. */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: FieldErrors,
    public readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class ValidationError extends AppError {
  constructor(fields: FieldErrors, message = "Some fields need attention.") {
    super(400, "validation_failed", message, fields);
  }
}
export class UnauthorizedError extends AppError {
  constructor(message = "Sign in to continue.", code = "unauthenticated") {
    super(401, code, message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = "Your role may not do this.", code = "forbidden") {
    super(403, code, message);
  }
}
export class NotFoundError extends AppError {
  constructor(message = "Not found.") {
    super(404, "not_found", message);
  }
}
export class ConflictError extends AppError {
  constructor(code: string, message: string) {
    super(409, code, message);
  }
}
export class UnsupportedMediaTypeError extends AppError {
  constructor(message = "Send the body as application/json.", fields?: FieldErrors) {
    super(415, "unsupported_media_type", message, fields);
  }
}
export class PayloadTooLargeError extends AppError {
  constructor(limitBytes: number, field?: string) {
    const message = `The file is larger than the limit of ${Math.round(limitBytes / 1024 / 1024)} MB.`;
    super(413, "payload_too_large", message, field ? { [field]: [message] } : undefined);
  }
}
export class TooManyRequestsError extends AppError {
  constructor(retryAfterSeconds: number, code = "too_many_attempts", message?: string) {
    super(
      429,
      code,
      message ?? `Too many attempts. Try again in ${retryAfterSeconds} seconds.`,
      undefined,
      { "Retry-After": String(retryAfterSeconds) },
    );
  }
}
export class ServiceUnavailableError extends AppError {
  constructor(message = "The database is not reachable right now. Try again in a moment.") {
    super(503, "service_unavailable", message, undefined, { "Retry-After": "5" });
  }
}

export interface ErrorBody {
  error: { code: string; message: string; fields?: FieldErrors };
}

const CONNECTION_ERRORS = new Set([
  "SequelizeConnectionError",
  "SequelizeConnectionRefusedError",
  "SequelizeConnectionAcquireTimeoutError",
  "SequelizeConnectionTimedOutError",
  "SequelizeHostNotReachableError",
  "SequelizeAccessDeniedError",
]);
const CONNECTION_CODES = new Set(["ECONNREFUSED", "ETIMEDOUT", "PROTOCOL_CONNECTION_LOST", "ER_CON_COUNT_ERROR", "ECONNRESET"]);

/** Maps anything thrown to an AppError; unexpected errors are logged and become a plain sentence. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  const name = (error as { name?: string } | null)?.name ?? "";
  const code = (error as { code?: string } | null)?.code ?? "";
  if (CONNECTION_ERRORS.has(name) || CONNECTION_CODES.has(code)) {
    log("error", "database_unavailable", { name, code });
    return new ServiceUnavailableError();
  }
  log("error", "unexpected_error", {
    name,
    message: error instanceof Error ? error.message : String(error),
    stack: error instanceof Error ? error.stack : undefined,
  });
  return new AppError(500, "internal_error", "Something went wrong on our side. It has been logged.");
}

export function errorBody(error: AppError): ErrorBody {
  return {
    error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) },
  };
}

/** The JSON error response for anything thrown in a route handler. */
export function errorResponse(error: unknown): Response {
  const appError = toAppError(error);
  return jsonResponse(errorBody(appError), { status: appError.status, headers: appError.headers });
}
