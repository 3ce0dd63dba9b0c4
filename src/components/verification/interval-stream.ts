// Reads the intervals endpoint's stream of JSON lines (progress, then the result) for the report island.
import type { IntervalsMessage, IntervalsResult } from "@/lib/query/verification";

/** Resolves with the final result, or rejects with the server's message. */
export async function streamIntervals(
  url: string,
  onProgress: (done: number, total: number, label: string) => void,
  signal?: AbortSignal,
): Promise<IntervalsResult> {
  const res = await fetch(url, {
    headers: { Accept: "application/x-ndjson" },
    signal: signal ?? null,
  });
  if (!res.ok || !res.body) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new Error(body?.error?.message ?? `The desk answered ${res.status}.`);
  }
  const reader = res.body.pipeThrough(new TextDecoderStream()).getReader();
  let buffer = "";
  for (;;) {
    const { done, value } = await reader.read();
    buffer += value ?? "";
    const lines = buffer.split("\n");
    buffer = done ? "" : (lines.pop() ?? "");
    for (const line of lines) {
      if (!line.trim()) continue;
      const message = JSON.parse(line) as IntervalsMessage;
      if (message.type === "progress") onProgress(message.done, message.total, message.label);
      else if (message.type === "result") return message.result;
      else throw new Error(message.message);
    }
    if (done) throw new Error("The interval computation stopped before it finished.");
  }
}
