import { afterEach, describe, expect, it, vi } from "vitest";
import { AppError, describeError, errorResponse, type ErrorCode } from "@/server/http/errors";

// Status codes: RFC 9110 §15.5 (400, 401, 403, 404, 409, 413, 422) and RFC 6585 §4 (429).
const EXPECTED_STATUS: Record<ErrorCode, number> = {
  BAD_REQUEST: 400,
  UNAUTHORIZED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  PAYLOAD_TOO_LARGE: 413,
  UNPROCESSABLE_CONTENT: 422,
  TOO_MANY_REQUESTS: 429,
};

afterEach(() => vi.restoreAllMocks());

describe("describeError", () => {
  it.each(Object.entries(EXPECTED_STATUS))(
    "maps %s to %i with a JSON error body",
    (code, status) => {
      const described = describeError(new AppError(code as ErrorCode, `message for ${code}`));
      expect(described).toEqual({
        status,
        body: { error: { code, message: `message for ${code}` } },
        headers: {},
      });
    },
  );

  it("adds Retry-After in whole seconds only when the error carries one", () => {
    const throttled = new AppError("TOO_MANY_REQUESTS", "slow down", { retryAfterSeconds: 840 });
    expect(describeError(throttled).headers).toEqual({ "Retry-After": "840" });
    expect(describeError(new AppError("TOO_MANY_REQUESTS", "slow down")).headers).toEqual({});
  });

  it("passes field messages through, and leaves them out when there are none", () => {
    const withFields = new AppError("CONFLICT", "taken", { fields: { email: "In use." } });
    expect(describeError(withFields).body.error.fields).toEqual({ email: "In use." });
    expect("fields" in describeError(new AppError("CONFLICT", "taken")).body.error).toBe(false);
  });

  it("answers any other error with a plain 500 that reveals nothing of the cause", () => {
    for (const err of [
      new Error("password column missing"),
      "a string",
      null,
      { code: "CONFLICT" },
    ]) {
      const described = describeError(err);
      expect(described.status).toBe(500);
      expect(described.body).toEqual({
        error: { code: "INTERNAL", message: "Something went wrong on the server." },
      });
      expect(JSON.stringify(described.body)).not.toContain("password");
    }
  });

  it("does not take a look-alike object with a known code for an AppError", () => {
    const lookAlike = Object.assign(new Error("x"), { code: "NOT_FOUND" });
    expect(describeError(lookAlike).status).toBe(500);
  });
});

describe("errorResponse", () => {
  it("builds a JSON response with status and headers, without logging client errors", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const response = errorResponse(
      new AppError("TOO_MANY_REQUESTS", "Try again later.", { retryAfterSeconds: 60 }),
    );
    expect(response.status).toBe(429);
    expect(response.headers.get("Retry-After")).toBe("60");
    expect(response.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(await response.json()).toEqual({
      error: { code: "TOO_MANY_REQUESTS", message: "Try again later." },
    });
    expect(log).not.toHaveBeenCalled();
  });

  it("logs an unknown error with its cause and answers 500", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const cause = new Error("disk full");
    const response = errorResponse(cause);
    expect(response.status).toBe(500);
    expect(response.headers.get("Retry-After")).toBeNull();
    expect(await response.json()).toEqual({
      error: { code: "INTERNAL", message: "Something went wrong on the server." },
    });
    expect(log).toHaveBeenCalledWith(expect.any(String), cause);
  });
});
