// Owns what a person sees when an acknowledgement or unsubscribe link cannot be used: a plain
// sentence saying what to do next, and the HTTP status of the page.
import type { LinkFailure } from "./link-tokens";

export interface LinkRefusal {
  ok: false;
  reason: LinkFailure;
  status: number;
  message: string;
}

const STATUS: Record<LinkFailure, number> = {
  malformed: 400,
  "bad-signature": 400,
  "wrong-purpose": 400,
  expired: 410,
  unknown: 404,
  "not-this-alert": 403,
  used: 409,
};

const ACK_TEXT: Record<Exclude<LinkFailure, "used">, string> = {
  malformed:
    "This acknowledgement link is incomplete or damaged. Copy the whole link from the alert e-mail.",
  "bad-signature":
    "This acknowledgement link is not valid: it may have been changed. Use the link in the alert e-mail, or call the duty desk.",
  "wrong-purpose": "This link is not an acknowledgement link.",
  expired:
    "This alert's validity window has ended, so it can no longer be acknowledged with this link. Call the duty desk if you need to.",
  unknown: "This alert no longer exists. Call the duty desk if you expected one.",
  "not-this-alert": "This acknowledgement link belongs to a different alert.",
};

const UNSUBSCRIBE_TEXT: Record<Exclude<LinkFailure, "used" | "not-this-alert">, string> = {
  malformed: "This unsubscribe link is incomplete or damaged. Copy the whole link from the e-mail.",
  "bad-signature":
    "This unsubscribe link is not valid: it may have been changed. Use the link in a recent e-mail from the desk.",
  "wrong-purpose": "This link is not an unsubscribe link.",
  expired:
    "This unsubscribe link has expired. Use the link in a more recent e-mail, or ask the duty desk to remove you.",
  unknown: "This address is no longer on the distribution list.",
};

export function refuseAck(reason: LinkFailure, usedAt?: string): LinkRefusal {
  const message =
    reason === "used"
      ? `This alert was already acknowledged at ${usedAt ?? "an earlier time"}. Nothing more to do.`
      : ACK_TEXT[reason];
  return { ok: false, reason, status: STATUS[reason], message };
}

export function refuseUnsubscribe(reason: LinkFailure, usedAt?: string): LinkRefusal {
  const message =
    reason === "used"
      ? `This address was already unsubscribed at ${usedAt ?? "an earlier time"}. No further e-mails are sent to it.`
      : reason === "not-this-alert"
        ? UNSUBSCRIBE_TEXT["bad-signature"]
        : UNSUBSCRIBE_TEXT[reason];
  return { ok: false, reason, status: STATUS[reason], message };
}
