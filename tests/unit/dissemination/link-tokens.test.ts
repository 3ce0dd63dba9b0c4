import { describe, expect, it } from "vitest";
import {
  ackExpiry,
  isClaimForAlert,
  readAckToken,
  readUnsubscribeToken,
  signAckToken,
  signUnsubscribeToken,
  unsubscribeExpiry,
} from "@/server/dissemination/link-tokens";

const SECRET = "unit-test-secret-0123456789-abcdefghijklmnop";
const NOW = new Date("2026-05-04T00:30:00Z");
const LATER = new Date("2026-05-04T06:00:00Z");

function tamper(token: string, edit: (payload: Record<string, unknown>) => void): string {
  const [body, signature] = token.split(".") as [string, string];
  const envelope = JSON.parse(Buffer.from(body, "base64url").toString("utf8")) as {
    d: Record<string, unknown>;
  };
  edit(envelope.d);
  return `${Buffer.from(JSON.stringify(envelope)).toString("base64url")}.${signature}`;
}

describe("acknowledgement tokens", () => {
  const token = signAckToken(SECRET, { alertId: 11, contactId: 7 }, ackExpiry(NOW, 24));

  it("read back the alert and contact they were signed for", () => {
    const check = readAckToken(SECRET, token, LATER);
    expect(check).toMatchObject({ ok: true, payload: { alertId: 11, contactId: 7 } });
  });

  it("are bound to one alert and its contact: alert A's token is refused for alert B", () => {
    const check = readAckToken(SECRET, token, LATER);
    if (!check.ok) throw new Error("expected a valid token");
    expect(isClaimForAlert(check.payload, { id: 11, contactId: 7 })).toBe(true);
    expect(isClaimForAlert(check.payload, { id: 12, contactId: 7 })).toBe(false);
    expect(isClaimForAlert(check.payload, { id: 11, contactId: 8 })).toBe(false);
  });

  it("cannot be re-pointed at another alert: changing the payload breaks the signature", () => {
    expect(
      readAckToken(
        SECRET,
        tamper(token, (d) => (d.a = 12)),
        LATER,
      ),
    ).toEqual({ ok: false, reason: "bad-signature" });
    expect(
      readAckToken(
        SECRET,
        tamper(token, (d) => (d.c = 8)),
        LATER,
      ),
    ).toEqual({ ok: false, reason: "bad-signature" });
  });

  it("expire when the alert's window ends", () => {
    expect(readAckToken(SECRET, token, new Date("2026-05-05T00:29:59Z")).ok).toBe(true);
    expect(readAckToken(SECRET, token, new Date("2026-05-05T00:30:00Z"))).toEqual({
      ok: false,
      reason: "expired",
    });
  });

  it("are refused with another secret, when cut short, and as unsubscribe links", () => {
    expect(readAckToken(`${SECRET}x`, token, LATER)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
    expect(readAckToken(SECRET, token.slice(0, token.indexOf(".")), LATER)).toEqual({
      ok: false,
      reason: "malformed",
    });
    // Each purpose has its own derived key, so one kind of link never passes for another.
    expect(readUnsubscribeToken(SECRET, token, LATER)).toEqual({
      ok: false,
      reason: "bad-signature",
    });
  });
});

describe("unsubscribe tokens", () => {
  const token = signUnsubscribeToken(SECRET, { contactId: 7 }, unsubscribeExpiry(NOW));

  it("name the contact and stay valid for 60 days from the queue time", () => {
    expect(readUnsubscribeToken(SECRET, token, new Date("2026-07-03T00:29:00Z"))).toMatchObject({
      ok: true,
      payload: { contactId: 7 },
    });
    expect(readUnsubscribeToken(SECRET, token, new Date("2026-07-03T00:30:00Z"))).toEqual({
      ok: false,
      reason: "expired",
    });
  });

  it("are the same string when signed again from the same queue time (a retry resends identical bytes)", () => {
    expect(signUnsubscribeToken(SECRET, { contactId: 7 }, unsubscribeExpiry(NOW))).toBe(token);
    expect(signUnsubscribeToken(SECRET, { contactId: 8 }, unsubscribeExpiry(NOW))).not.toBe(token);
  });

  it("refuse a changed contact and an acknowledgement token", () => {
    expect(
      readUnsubscribeToken(
        SECRET,
        tamper(token, (d) => (d.c = 9)),
        NOW,
      ),
    ).toEqual({ ok: false, reason: "bad-signature" });
    const ack = signAckToken(SECRET, { alertId: 1, contactId: 7 }, ackExpiry(NOW, 24));
    expect(readAckToken(SECRET, token, NOW)).toEqual({ ok: false, reason: "bad-signature" });
    expect(readAckToken(SECRET, ack, NOW).ok).toBe(true);
  });
});
