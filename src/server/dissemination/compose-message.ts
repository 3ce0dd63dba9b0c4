// Owns turning a due outbox row into the message handed to the provider: self-contained rows as
// stored, bulletin rows as the bulletin's shared body with the recipient's unsubscribe link.
import type { Db, Tx } from "@/db/client";
import type { MailMessage } from "@/server/email/send";
import type { DueRow } from "./delivery-claim.db";
import { signUnsubscribeToken, unsubscribeExpiry } from "./link-tokens";
import { compileMerge, MERGE_FIELDS, type MergeTemplate } from "./mail-merge";
import { findBulletinBody } from "./outbox.db";

export type Composed =
  { ok: true; message: MailMessage; bytes: number } | { ok: false; error: string };

// Bodies never change once stored, so a process may keep the recent ones, cut and measured.
const BODY_CACHE_SIZE = 16;
interface CachedBody {
  template: MergeTemplate;
  /** JSON bytes of the body with the placeholder words removed. */
  baseBytes: number;
  placeholders: number;
}
const bodies = new Map<number, CachedBody>();

async function loadBody(db: Db | Tx, bulletinId: number): Promise<CachedBody | null> {
  const cached = bodies.get(bulletinId);
  if (cached) return cached;
  const body = await findBulletinBody(db, bulletinId);
  if (!body) return null;
  const word = MERGE_FIELDS.unsubscribeToken;
  const placeholders =
    body.html.split(word).length -
    1 +
    (body.text.split(word).length - 1) +
    (body.subject.split(word).length - 1);
  const entry = {
    template: compileMerge(body),
    baseBytes: measureMessage({ to: "", ...body }) - placeholders * word.length,
    placeholders,
  };
  if (bodies.size >= BODY_CACHE_SIZE) bodies.delete(bodies.keys().next().value as number);
  bodies.set(bulletinId, entry);
  return entry;
}

/** Bytes the message adds to a JSON batch request (what the provider's size limit counts). */
export function measureMessage(
  message: Pick<MailMessage, "to" | "subject" | "html" | "text">,
): number {
  return (
    Buffer.byteLength(
      JSON.stringify({
        to: message.to,
        subject: message.subject,
        html: message.html,
        text: message.text,
      }),
    ) + 256
  );
}

export async function composeMessage(db: Db | Tx, row: DueRow, secret: string): Promise<Composed> {
  const tags = { kind: row.kind.replace(/[^A-Za-z0-9_-]/g, "_") };
  if (row.kind === "bulletin" && row.html === "") {
    if (row.bulletinId === null || row.contactId === null)
      return { ok: false, error: "bulletin delivery without its bulletin or contact" };
    const body = await loadBody(db, row.bulletinId);
    if (!body) return { ok: false, error: `no stored body for bulletin ${row.bulletinId}` };
    // The expiry comes from the stored queue time, so every retry sends byte-identical content.
    const token = signUnsubscribeToken(
      secret,
      { contactId: row.contactId },
      unsubscribeExpiry(row.createdAt),
    );
    const content = body.template.fill({ unsubscribeToken: token });
    const bytes =
      body.baseBytes + body.placeholders * token.length + Buffer.byteLength(row.toEmail);
    return {
      ok: true,
      message: { to: row.toEmail, ...content, idempotencyKey: row.idempotencyKey, tags },
      bytes,
    };
  }
  const message: MailMessage = {
    to: row.toEmail,
    subject: row.subject,
    html: row.html,
    text: row.text,
    idempotencyKey: row.idempotencyKey,
    tags,
  };
  return { ok: true, message, bytes: measureMessage(message) };
}
