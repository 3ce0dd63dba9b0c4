// Reads what the local e-mail fake caught, for the admin mailbox (fake mode only).
import { readConfig } from "@/server/config";
import { AppError } from "@/server/http/errors";

export interface CaughtMessage {
  id: string;
  from: string;
  to: string[] | string;
  subject: string;
  html?: string;
  text?: string;
  receivedAt: string;
}

function fakeUrl(): string {
  const config = readConfig();
  if (!config.isEmailFake || !config.resendBaseUrl) {
    throw new AppError("NOT_FOUND", "The mailbox exists only while the local e-mail fake is in use.");
  }
  return config.resendBaseUrl.replace(/\/$/, "");
}

export async function listCaught(query: { to?: string; page: number; pageSize: number }): Promise<{ total: number; messages: CaughtMessage[] }> {
  const params = new URLSearchParams({ limit: String(query.pageSize), offset: String((query.page - 1) * query.pageSize) });
  if (query.to) params.set("to", query.to);
  const res = await fetch(`${fakeUrl()}/_fake/messages?${params}`);
  if (!res.ok) throw new Error(`mailbox fake answered ${res.status}`);
  return (await res.json()) as { total: number; messages: CaughtMessage[] };
}

export async function getCaught(id: string): Promise<CaughtMessage> {
  const res = await fetch(`${fakeUrl()}/_fake/messages/${encodeURIComponent(id)}`);
  if (res.status === 404) throw new AppError("NOT_FOUND", "No such message in the mailbox.");
  if (!res.ok) throw new Error(`mailbox fake answered ${res.status}`);
  return (await res.json()) as CaughtMessage;
}
