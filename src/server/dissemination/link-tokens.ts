// Owns the signed links in dissemination e-mails: acknowledgement (bound to one alert and its
// contact, valid until the alert's window ends) and unsubscribe (bound to one contact).
import {
  deriveKey,
  signToken,
  verifyToken,
  type TokenCheck,
  type TokenFailure,
} from "@/server/auth/signed-tokens";

export const ACK_PURPOSE = "alert-ack";
export const UNSUBSCRIBE_PURPOSE = "unsubscribe";

/**
 * Unsubscribe links keep working for 60 days after the e-mail was queued: longer than the
 * 30 days the US CAN-SPAM Act asks of an opt-out mechanism (15 U.S.C. §7704(a)(3); from memory).
 */
export const UNSUBSCRIBE_TTL_DAYS = 60;

export interface AckClaim {
  alertId: number;
  contactId: number;
}

export interface UnsubscribeClaim {
  contactId: number;
}

interface AckPayload {
  a: number;
  c: number;
}

interface UnsubscribePayload {
  c: number;
}

/** An alert is about its validity window; once that has ended there is nothing to acknowledge. */
export function ackExpiry(issueTime: Date, windowHours: number): Date {
  return new Date(issueTime.getTime() + windowHours * 3600_000);
}

/** Derived from the stored queue time, so a retried message carries the very same link. */
export function unsubscribeExpiry(queuedAt: Date): Date {
  return new Date(queuedAt.getTime() + UNSUBSCRIBE_TTL_DAYS * 86_400_000);
}

export function signAckToken(secret: string, claim: AckClaim, expiresAt: Date): string {
  const payload: AckPayload = { a: claim.alertId, c: claim.contactId };
  return signToken(deriveKey(secret, ACK_PURPOSE), ACK_PURPOSE, payload, expiresAt);
}

export function signUnsubscribeToken(
  secret: string,
  claim: UnsubscribeClaim,
  expiresAt: Date,
): string {
  const payload: UnsubscribePayload = { c: claim.contactId };
  return signToken(deriveKey(secret, UNSUBSCRIBE_PURPOSE), UNSUBSCRIBE_PURPOSE, payload, expiresAt);
}

const isId = (v: unknown): v is number => typeof v === "number" && Number.isSafeInteger(v) && v > 0;

export function readAckToken(secret: string, token: string, now: Date): TokenCheck<AckClaim> {
  const check = verifyToken<AckPayload>(deriveKey(secret, ACK_PURPOSE), ACK_PURPOSE, token, now);
  if (!check.ok) return check;
  const { a, c } = check.payload ?? ({} as Partial<AckPayload>);
  if (!isId(a) || !isId(c)) return { ok: false, reason: "malformed" };
  return { ok: true, payload: { alertId: a, contactId: c }, expiresAt: check.expiresAt };
}

export function readUnsubscribeToken(
  secret: string,
  token: string,
  now: Date,
): TokenCheck<UnsubscribeClaim> {
  const check = verifyToken<UnsubscribePayload>(
    deriveKey(secret, UNSUBSCRIBE_PURPOSE),
    UNSUBSCRIBE_PURPOSE,
    token,
    now,
  );
  if (!check.ok) return check;
  const c = check.payload?.c;
  if (!isId(c)) return { ok: false, reason: "malformed" };
  return { ok: true, payload: { contactId: c }, expiresAt: check.expiresAt };
}

/** The alert a link names must be the alert acted on, and belong to the contact it names. */
export function isClaimForAlert(
  claim: AckClaim,
  alert: { id: number; contactId: number },
): boolean {
  return claim.alertId === alert.id && claim.contactId === alert.contactId;
}

export type LinkFailure = TokenFailure | "unknown" | "not-this-alert" | "used";
