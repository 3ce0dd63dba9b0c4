// The one application error type and its mapping to HTTP status codes and JSON bodies.
export const ERROR_STATUS = {
  BAD_REQUEST: 400,
  UNAUTHORIZED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  PAYLOAD_TOO_LARGE: 413,
  UNPROCESSABLE_CONTENT: 422,
  TOO_MANY_REQUESTS: 429,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;
export type FieldErrors = Record<string, string>;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields: FieldErrors | undefined;
  readonly retryAfterSeconds: number | undefined;

  constructor(
    code: ErrorCode,
    message: string,
    options: { fields?: FieldErrors; retryAfterSeconds?: number; cause?: unknown } = {},
  ) {
    super(message, { cause: options.cause });
    this.name = "AppError";
    this.code = code;
    this.fields = options.fields;
    this.retryAfterSeconds = options.retryAfterSeconds;
  }
}

export interface ErrorBody {
  error: { code: ErrorCode | "INTERNAL"; message: string; fields?: FieldErrors };
}

export function describeError(err: unknown): { status: number; body: ErrorBody; headers: Record<string, string> } {
  if (err instanceof AppError) {
    const headers: Record<string, string> = {};
    if (err.retryAfterSeconds !== undefined) headers["Retry-After"] = String(err.retryAfterSeconds);
    const body: ErrorBody = { error: { code: err.code, message: err.message } };
    if (err.fields) body.error.fields = err.fields;
    return { status: ERROR_STATUS[err.code], body, headers };
  }
  return {
    status: 500,
    body: { error: { code: "INTERNAL", message: "Something went wrong on the server." } },
    headers: {},
  };
}

export function errorResponse(err: unknown): Response {
  const { status, body, headers } = describeError(err);
  // A 413 is sent before the body is read: close the connection so the rest is not taken as the next request.
  if (status === 413) headers.Connection = "close";
  if (status === 500) console.error("[facula] unhandled error", err);
  return Response.json(body, { status, headers });
}
