// Invitation tokens: signed with a key derived from AUTH_SECRET, bound to one invitation row and
// its nonce, valid for 72 hours, usable once (the row records its use).
import { randomBytes } from "node:crypto";
import { deriveKey, signToken, verifyToken, type TokenFailure } from "@/server/auth/signed-tokens";
import { requireAuthSecret } from "@/server/config";

export const INVITATION_TTL_HOURS = 72;
const PURPOSE = "invitation";

export interface InvitationClaim {
  invitationId: number;
  nonce: string;
}

export function newNonce(): string {
  return randomBytes(16).toString("base64url");
}

export function invitationExpiry(now: Date): Date {
  return new Date(now.getTime() + INVITATION_TTL_HOURS * 3600_000);
}

export function signInvitation(claim: InvitationClaim, expiresAt: Date): string {
  return signToken(deriveKey(requireAuthSecret(), PURPOSE), PURPOSE, claim, expiresAt);
}

export function readInvitation(token: string, now: Date) {
  return verifyToken<InvitationClaim>(deriveKey(requireAuthSecret(), PURPOSE), PURPOSE, token, now);
}

export const INVITATION_FAILURE_TEXT: Record<TokenFailure | "used" | "revoked" | "unknown", string> = {
  malformed: "This invitation link is incomplete or damaged. Copy the whole link from the e-mail.",
  "bad-signature": "This invitation link is not valid. Ask your administrator for a new invitation.",
  "wrong-purpose": "This link is not an invitation link.",
  expired: "This invitation link has expired. Ask your administrator to send a new one.",
  used: "This invitation link has already been used. Sign in with the password you set.",
  revoked: "This invitation was replaced by a newer one. Use the link in the latest e-mail.",
  unknown: "This invitation no longer exists. Ask your administrator for a new invitation.",
};
