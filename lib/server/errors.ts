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
const CONNECTION_CODES = new Set([
  "ECONNREFUSED",
  "ETIMEDOUT",
  "ECONNRESET",
  "EPIPE",
  "EHOSTUNREACH",
  "ENETUNREACH",
  // mysql2 (the session pool)
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "ER_CON_COUNT_ERROR",
  // the mariadb driver (Sequelize and the bulk-read pool)
  "ER_SOCKET_UNEXPECTED_CLOSE",
  "ER_SOCKET_TIMEOUT",
  "ER_CONNECTION_TIMEOUT",
  "ER_GET_CONNECTION_TIMEOUT",
  "ER_CMD_CONNECTION_CLOSED",
  "ER_CONNECTION_ALREADY_CLOSED",
  "ER_CMD_NOT_EXECUTED_DESTROYED",
]);

type DriverError = { name?: string; code?: string; sqlState?: string; parent?: unknown; original?: unknown; cause?: unknown };

/**
 * The name and code of a lost or refused database connection, looking through Sequelize's wrapper to the driver's
 * error (a connection dropped mid-statement arrives as a SequelizeDatabaseError). SQLSTATE class 08 is "connection
 * exception" in the SQL standard.
 */
function connectionFailure(error: unknown): { name: string; code: string } | null {
  let current = error as DriverError | null | undefined;
  for (let depth = 0; current && typeof current === "object" && depth < 4; depth++) {
    const name = current.name ?? "";
    const code = current.code ?? "";
    if (CONNECTION_ERRORS.has(name) || CONNECTION_CODES.has(code) || current.sqlState?.startsWith("08")) return { name, code };
    current = (current.parent ?? current.original ?? current.cause) as DriverError | undefined;
  }
  return null;
}

/**
 * An outage fails every request: the log gets its first failure, then one line a while with the count since. A
 * failure after the database has answered again starts a new outage and is logged at once.
 */
const OUTAGE_LOG_EVERY_MS = 10_000;
const outage = ((globalThis as { __greaseledgerOutageLog?: { lastAt: number; since: number; answeredSince: boolean } }).__greaseledgerOutageLog ??= {
  lastAt: 0,
  since: 0,
  answeredSince: true,
});

/** Called when a statement succeeds (the session pool's, which starts every request): an outage is over. */
export function noteDatabaseAnswered(): void {
  outage.answeredSince = true;
}

function logDatabaseUnavailable(failure: { name: string; code: string }): void {
  const now = Date.now();
  if (!outage.answeredSince && now - outage.lastAt < OUTAGE_LOG_EVERY_MS) {
    outage.since += 1;
    return;
  }
  log("error", "database_unavailable", { ...failure, alsoRefusedSinceLastLine: outage.since });
  outage.lastAt = now;
  outage.since = 0;
  outage.answeredSince = false;
}

/** Maps anything thrown to an AppError; unexpected errors are logged and become a plain sentence. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  const failure = connectionFailure(error);
  if (failure) {
    logDatabaseUnavailable(failure);
    return new ServiceUnavailableError();
  }
  const name = (error as { name?: string } | null)?.name ?? "";
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
