// Signed, expiring tokens for links in e-mails (invitations now; acknowledgements and
// unsubscribe links later). HMAC-SHA256 over a purpose-bound payload (RFC 2104).
import { createHmac, timingSafeEqual } from "node:crypto";

export type TokenFailure = "malformed" | "bad-signature" | "expired" | "wrong-purpose";
export type TokenCheck<T> = { ok: true; payload: T; expiresAt: Date } | { ok: false; reason: TokenFailure };

interface Envelope<T> {
  p: string;
  e: number;
  d: T;
}

function sign(secret: string, body: string): string {
  return createHmac("sha256", secret).update(body).digest("base64url");
}

export function signToken<T>(secret: string, purpose: string, data: T, expiresAt: Date): string {
  const envelope: Envelope<T> = { p: purpose, e: Math.floor(expiresAt.getTime() / 1000), d: data };
  const body = Buffer.from(JSON.stringify(envelope)).toString("base64url");
  return `${body}.${sign(secret, body)}`;
}

export function verifyToken<T>(secret: string, purpose: string, token: string, now: Date): TokenCheck<T> {
  const parts = token.split(".");
  if (parts.length !== 2 || !parts[0] || !parts[1]) return { ok: false, reason: "malformed" };
  const [body, signature] = parts as [string, string];
  const expected = Buffer.from(sign(secret, body));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) {
    return { ok: false, reason: "bad-signature" };
  }
  let envelope: Envelope<T>;
  try {
    envelope = JSON.parse(Buffer.from(body, "base64url").toString("utf8")) as Envelope<T>;
  } catch {
    return { ok: false, reason: "malformed" };
  }
  if (typeof envelope !== "object" || envelope === null || typeof envelope.e !== "number") {
    return { ok: false, reason: "malformed" };
  }
  if (envelope.p !== purpose) return { ok: false, reason: "wrong-purpose" };
  const expiresAt = new Date(envelope.e * 1000);
  if (now.getTime() >= expiresAt.getTime()) return { ok: false, reason: "expired" };
  return { ok: true, payload: envelope.d, expiresAt };
}

/** Derives a key per purpose so one leaked token kind cannot forge another. */
export function deriveKey(masterSecret: string, purpose: string): string {
  return createHmac("sha256", masterSecret).update(`facula:${purpose}`).digest("base64url");
}
