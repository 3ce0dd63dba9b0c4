// Owns sending rendered e-mails through the Resend SDK (real service or the local fake).
import { createHash } from "node:crypto";
import { Resend } from "resend";
import type { SendResult } from "./send-result";
import { toSendFailure, toSendSuccess } from "./send-result";

export type { SendFailure, SendResult, SendSuccess } from "./send-result";

export const RESEND_API_URL = "https://api.resend.com";
/** Resend's limit on one batch request. */
export const MAX_BATCH_SIZE = 100;

export interface MailerConfig {
  apiKey: string;
  /** Defaults to the real service; anything else is taken to be the local fake. */
  baseUrl?: string;
  from: string;
}

export interface MailMessage {
  to: string;
  subject: string;
  html: string;
  text: string;
  idempotencyKey?: string;
  tags?: Record<string, string>;
}

export interface MailerHealth {
  ok: boolean;
  detail: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<SendResult>;
  sendBatch(messages: readonly MailMessage[]): Promise<SendResult[]>;
  checkHealth(): Promise<MailerHealth>;
}

function toTags(tags: Record<string, string> | undefined) {
  return tags ? Object.entries(tags).map(([name, value]) => ({ name, value })) : undefined;
}

/**
 * A batch request carries one idempotency key. When every message has its own key, the batch key
 * is derived from them, so a retried batch of the same messages is recognised; otherwise none.
 */
function deriveBatchKey(messages: readonly MailMessage[]): string | undefined {
  const keys = messages.map((m) => m.idempotencyKey);
  if (keys.some((key) => !key)) return undefined;
  return `batch-${createHash("sha256").update(keys.join("\n")).digest("hex")}`;
}

async function probeFake(baseUrl: string): Promise<MailerHealth> {
  try {
    const response = await fetch(`${baseUrl}/_fake/health`, { signal: AbortSignal.timeout(2000) });
    const body = (await response.json()) as { ok?: unknown; count?: unknown };
    if (response.ok && body.ok === true) {
      return { ok: true, detail: `Resend fake at ${baseUrl} holds ${String(body.count)} messages` };
    }
    return { ok: false, detail: `Resend fake at ${baseUrl} answered ${response.status}` };
  } catch (error) {
    return { ok: false, detail: `Resend fake at ${baseUrl} unreachable: ${String(error)}` };
  }
}

export function createMailer(config: MailerConfig): Mailer {
  if (!config.apiKey) throw new Error("Mailer needs an API key");
  if (!config.from) throw new Error("Mailer needs a sender address");
  const baseUrl = (config.baseUrl ?? RESEND_API_URL).replace(/\/+$/, "");
  const isFake = baseUrl !== RESEND_API_URL;
  // The base URL is always passed so the SDK never falls back to RESEND_BASE_URL on its own.
  const resend = new Resend(config.apiKey, { baseUrl });

  const toPayload = (message: MailMessage) => ({
    from: config.from,
    to: message.to,
    subject: message.subject,
    html: message.html,
    text: message.text,
    tags: toTags(message.tags),
  });

  return {
    async send(message) {
      const idempotencyKey = message.idempotencyKey;
      const answer = await resend.emails.send(toPayload(message), { idempotencyKey });
      return answer.error
        ? toSendFailure(answer.error, answer.headers)
        : toSendSuccess(answer.data);
    },

    async sendBatch(messages) {
      if (messages.length > MAX_BATCH_SIZE) {
        throw new RangeError(
          `A batch holds at most ${MAX_BATCH_SIZE} messages, got ${messages.length}`,
        );
      }
      if (messages.length === 0) return [];
      const idempotencyKey = deriveBatchKey(messages);
      const answer = await resend.batch.send(messages.map(toPayload), { idempotencyKey });
      // The batch is all-or-nothing at the API: one failure applies to every message.
      if (answer.error) {
        const failure = toSendFailure(answer.error, answer.headers);
        return messages.map(() => failure);
      }
      const sent = answer.data.data;
      return messages.map((_, index) => toSendSuccess(sent[index]));
    },

    async checkHealth() {
      if (isFake) return probeFake(baseUrl);
      // Never send a mail to check health: the real service is reported as configured only.
      return { ok: true, detail: `Resend API at ${baseUrl} configured (not probed)` };
    },
  };
}
