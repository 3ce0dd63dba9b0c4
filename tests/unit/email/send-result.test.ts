import { describe, expect, it } from "vitest";
import { isRetryableFailure, toSendFailure, toSendSuccess } from "@/server/email/send-result";

describe("isRetryableFailure", () => {
  it("retries when no answer came, on 408, 429 and 5xx", () => {
    // 408 and 5xx: RFC 9110 §15.5.9 and §15.6; 429: RFC 6585 §4.
    for (const status of [null, 408, 429, 500, 502, 503, 504]) {
      expect(isRetryableFailure(status)).toBe(true);
    }
  });

  it("does not retry a request the service refused as wrong", () => {
    for (const status of [400, 401, 403, 404, 405, 413, 422]) {
      expect(isRetryableFailure(status)).toBe(false);
    }
  });

  it("tells Resend's two 409 answers apart", () => {
    // Resend's error codes: concurrent_idempotent_requests asks for a retry, the other does not.
    expect(isRetryableFailure(409, "concurrent_idempotent_requests")).toBe(true);
    expect(isRetryableFailure(409, "invalid_idempotent_request")).toBe(false);
  });
});

describe("toSendFailure", () => {
  it("carries status, name, message and a Retry-After in seconds", () => {
    const failure = toSendFailure(
      { statusCode: 429, name: "rate_limit_exceeded", message: "slow down" },
      { "retry-after": "1" },
    );
    expect(failure).toEqual({
      ok: false,
      status: 429,
      retryable: true,
      message: "rate_limit_exceeded: slow down",
      retryAfterSeconds: 1,
    });
  });

  it("ignores a Retry-After that is not whole seconds and treats no status as no answer", () => {
    const failure = toSendFailure(
      { statusCode: null, name: "application_error", message: "Unable to fetch data." },
      { "retry-after": "Wed, 21 Oct 2015 07:28:00 GMT" },
    );
    expect(failure.status).toBeNull();
    expect(failure.retryable).toBe(true);
    expect(failure).not.toHaveProperty("retryAfterSeconds");
  });
});

describe("toSendSuccess", () => {
  it("returns the message id, and refuses an answer without one", () => {
    expect(toSendSuccess({ id: "abc" })).toEqual({ ok: true, id: "abc" });
    expect(toSendSuccess({})).toMatchObject({ ok: false, retryable: false });
    expect(toSendSuccess(null)).toMatchObject({ ok: false });
  });
});
