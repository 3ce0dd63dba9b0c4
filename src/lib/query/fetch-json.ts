// fetch for islands: JSON in and out, and the server's { error: { message, fields } } as an ApiError.
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

export async function fetchJson<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  const res = await fetch(url, {
    ...rest,
    headers: { Accept: "application/json", ...(json !== undefined ? { "Content-Type": "application/json" } : {}), ...headers },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  if (res.status === 204) return undefined as T;
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string> } } | null;
  if (!res.ok) {
    const message = body?.error?.message ?? `The desk answered ${res.status}.`;
    throw new ApiError(res.status, message, body?.error?.fields ?? {});
  }
  return body as T;
}
