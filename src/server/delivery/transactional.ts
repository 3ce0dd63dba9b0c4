// Sends one-off e-mails (invitations) straight away through the configured Resend client.
import { createMailer } from "@/server/email/send";
import { renderEmail } from "@/server/email/render";
import type { EmailTemplateData, EmailTemplateName } from "@/server/email/templates";
import { readConfig } from "@/server/config";

export type SendOutcome = { ok: true; id: string } | { ok: false; message: string };

let mailer: ReturnType<typeof createMailer> | null = null;

export function getMailer(): ReturnType<typeof createMailer> {
  if (!mailer) {
    const config = readConfig();
    mailer = createMailer({ apiKey: config.resendApiKey, baseUrl: config.resendBaseUrl, from: config.emailFrom });
  }
  return mailer;
}

export async function sendTemplate<N extends EmailTemplateName>(
  template: N,
  to: string,
  data: EmailTemplateData[N],
  idempotencyKey?: string,
): Promise<SendOutcome> {
  const { subject, html, text } = await renderEmail(template, data);
  const result = await getMailer().send({ to, subject, html, text, idempotencyKey });
  if (result.ok) return { ok: true, id: result.id };
  return { ok: false, message: result.message };
}
