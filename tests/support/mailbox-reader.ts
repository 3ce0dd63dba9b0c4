// Reads the local e-mail fake through the admin mailbox API, as an administrator would.
import type { HttpSession } from "./http-session";

export interface MailboxMessage {
  id: string;
  subject: string;
  to: string[] | string;
  text?: string;
  html?: string;
}

/** The newest message to an address, opened; fails when there is none. */
export async function newestMailTo(admin: HttpSession, to: string): Promise<MailboxMessage> {
  const list = await admin.fetch(`/api/admin/mailbox?to=${encodeURIComponent(to)}`);
  if (list.status !== 200) throw new Error(`mailbox list answered ${list.status}`);
  const { messages } = (await list.json()) as { messages: { id: string }[] };
  const id = messages[0]?.id;
  if (!id) throw new Error(`no message to ${to} in the mailbox`);
  const one = await admin.fetch(`/api/admin/mailbox/${encodeURIComponent(id)}`);
  if (one.status !== 200) throw new Error(`mailbox message answered ${one.status}`);
  return (await one.json()) as MailboxMessage;
}

/** The invitation link in a message's plain-text part. */
export function acceptLinkIn(message: MailboxMessage): URL {
  const match = /(https?:\/\/\S+\/invitations\/accept\?token=\S+)/.exec(message.text ?? "");
  if (!match?.[1]) throw new Error(`no invitation link in:\n${message.text}`);
  return new URL(match[1]);
}
