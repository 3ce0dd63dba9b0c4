import { createHmac } from "node:crypto";
import { describe, expect, it } from "vitest";
import { deriveKey, signToken, verifyToken } from "@/server/auth/signed-tokens";

const SECRET = "unit-test-secret-0123456789-abcdefghij";
const ISSUED = new Date("2026-03-10T08:00:00Z");
const EXPIRES = new Date("2026-03-13T08:00:00Z");
const claim = { invitationId: 7, nonce: "n-1" };

function decodeBody(token: string): unknown {
  return JSON.parse(Buffer.from(token.split(".")[0] ?? "", "base64url").toString("utf8"));
}

/** HMAC-SHA256 (RFC 2104) computed here with node:crypto, to forge bodies the module never made. */
function signBody(body: string, secret = SECRET): string {
  return `${body}.${createHmac("sha256", secret).update(body).digest("base64url")}`;
}

describe("signed tokens", () => {
  it("verifies a token it signed and returns the payload and the expiry", () => {
    const token = signToken(SECRET, "invitation", claim, EXPIRES);
    expect(verifyToken(SECRET, "invitation", token, ISSUED)).toEqual({
      ok: true,
      payload: claim,
      expiresAt: EXPIRES,
    });
  });

  it("binds purpose and expiry (whole seconds) into the signed body", () => {
    const token = signToken(SECRET, "invitation", claim, new Date(EXPIRES.getTime() + 999));
    expect(decodeBody(token)).toEqual({ p: "invitation", e: EXPIRES.getTime() / 1000, d: claim });
  });

  it("refuses a token whose body was changed but whose signature was kept", () => {
    const token = signToken(SECRET, "invitation", claim, EXPIRES);
    const [, signature] = token.split(".");
    const forgedBody = Buffer.from(
      JSON.stringify({
        p: "invitation",
        e: EXPIRES.getTime() / 1000,
        d: { ...claim, invitationId: 8 },
      }),
    ).toString("base64url");
    expect(verifyToken(SECRET, "invitation", `${forgedBody}.${signature}`, ISSUED)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
  });

  it("refuses a token whose signature was changed by one character", () => {
    const token = signToken(SECRET, "invitation", claim, EXPIRES);
    const last = token.at(-1) === "A" ? "B" : "A";
    expect(verifyToken(SECRET, "invitation", token.slice(0, -1) + last, ISSUED)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
    expect(verifyToken(SECRET, "invitation", token.slice(0, -2), ISSUED)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
  });

  it("refuses a token signed with another secret", () => {
    const token = signToken(`${SECRET}-other`, "invitation", claim, EXPIRES);
    expect(verifyToken(SECRET, "invitation", token, ISSUED).ok).toBe(false);
  });

  it("is valid up to the last second and expired from the expiry instant on (injected clock)", () => {
    const token = signToken(SECRET, "invitation", claim, EXPIRES);
    const justBefore = new Date(EXPIRES.getTime() - 1000);
    expect(verifyToken(SECRET, "invitation", token, justBefore).ok).toBe(true);
    expect(verifyToken(SECRET, "invitation", token, EXPIRES)).toEqual({
      ok: false,
      reason: "expired",
    });
    const later = new Date(EXPIRES.getTime() + 3600_000);
    expect(verifyToken(SECRET, "invitation", token, later)).toEqual({
      ok: false,
      reason: "expired",
    });
  });

  it("refuses a token made for another purpose with the same key", () => {
    const token = signToken(SECRET, "unsubscribe", claim, EXPIRES);
    expect(verifyToken(SECRET, "invitation", token, ISSUED)).toEqual({
      ok: false,
      reason: "wrong-purpose",
    });
    expect(verifyToken(SECRET, "unsubscribe", token, ISSUED).ok).toBe(true);
  });

  it.each(["", "abc", "a.b.c", ".sig", "body.", "..", "a..b"])("calls %j malformed", (token) => {
    expect(verifyToken(SECRET, "invitation", token, ISSUED)).toEqual({
      ok: false,
      reason: "malformed",
    });
  });

  it("calls a correctly signed body that is not an envelope malformed", () => {
    const notJson = Buffer.from("not json").toString("base64url");
    const noExpiry = Buffer.from(JSON.stringify({ p: "invitation", d: claim })).toString(
      "base64url",
    );
    const nullBody = Buffer.from("null").toString("base64url");
    for (const body of [notJson, noExpiry, nullBody]) {
      expect(verifyToken(SECRET, "invitation", signBody(body), ISSUED)).toEqual({
        ok: false,
        reason: "malformed",
      });
    }
    const good = Buffer.from(
      JSON.stringify({ p: "invitation", e: EXPIRES.getTime() / 1000, d: claim }),
    );
    expect(verifyToken(SECRET, "invitation", signBody(good.toString("base64url")), ISSUED).ok).toBe(
      true,
    );
  });
});

describe("deriveKey", () => {
  it("gives each purpose its own key, so one kind of token cannot pass as another", () => {
    const invitationKey = deriveKey(SECRET, "invitation");
    const otherKey = deriveKey(SECRET, "unsubscribe");
    expect(invitationKey).not.toBe(otherKey);
    expect(deriveKey(SECRET, "invitation")).toBe(invitationKey);
    const token = signToken(otherKey, "invitation", claim, EXPIRES);
    expect(verifyToken(invitationKey, "invitation", token, ISSUED)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
    expect(verifyToken(otherKey, "invitation", token, ISSUED).ok).toBe(true);
  });

  it("depends on the master secret", () => {
    expect(deriveKey(SECRET, "invitation")).not.toBe(deriveKey(`${SECRET}x`, "invitation"));
  });
});
