// Owns turning Resend SDK answers into send results that say whether a retry can help.

export interface SendSuccess {
  ok: true;
  id: string;
}

export interface SendFailure {
  ok: false;
  /** HTTP status of the answer; null when no answer came (network error, timeout). */
  status: number | null;
  retryable: boolean;
  message: string;
  /** From a Retry-After header given in seconds, when the service sent one. */
  retryAfterSeconds?: number;
}

export type SendResult = SendSuccess | SendFailure;

/** The shape of `error` in the SDK's `{ data, error, headers }` answer. */
export interface ResendErrorLike {
  statusCode?: number | null;
  name?: string;
  message?: string;
}

/**
 * No answer, 408, 429 and 5xx are transient (RFC 9110 §15.5.9, §15.6; RFC 6585 §4). Other 4xx
 * mean the request itself is wrong and will fail again — except Resend's
 * concurrent_idempotent_requests, which asks the client to retry once the first request is done.
 */
export function isRetryableFailure(status: number | null, name?: string): boolean {
  if (status === null) return true;
  if (status === 408 || status === 429 || status >= 500) return true;
  return name === "concurrent_idempotent_requests";
}

function readRetryAfter(headers: Record<string, string> | null): number | undefined {
  const raw = headers?.["retry-after"];
  if (raw === undefined || !/^\d+$/.test(raw.trim())) return undefined;
  return Number(raw.trim());
}

export function toSendFailure(
  error: ResendErrorLike,
  headers: Record<string, string> | null,
): SendFailure {
  const status = typeof error.statusCode === "number" ? error.statusCode : null;
  const retryAfterSeconds = readRetryAfter(headers);
  return {
    ok: false,
    status,
    retryable: isRetryableFailure(status, error.name),
    message: `${error.name ?? "error"}: ${error.message ?? "no message"}`,
    ...(retryAfterSeconds === undefined ? {} : { retryAfterSeconds }),
  };
}

export function toSendSuccess(data: unknown): SendResult {
  const id = (data as { id?: unknown } | null)?.id;
  if (typeof id === "string" && id !== "") return { ok: true, id };
  return { ok: false, status: null, retryable: false, message: "answer without a message id" };
}
