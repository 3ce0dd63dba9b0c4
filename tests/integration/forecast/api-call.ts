// Calls an endpoint module's handler in-process, as a signed-in user, and counts table rows.
import type { APIContext, APIRoute } from "astro";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";

export async function createActor(role: CurrentUser["role"], email: string): Promise<CurrentUser> {
  const [row] = await getDb()
    .insert(users)
    .values({ email, name: `Test ${role}`, role })
    .returning();
  if (!row) throw new Error("user insert returned nothing");
  return { id: row.id, email: row.email, name: row.name, role: row.role, organisationId: null };
}

export interface CallOptions {
  method: string;
  user: CurrentUser | null;
  body?: unknown;
  /** Sent as-is instead of JSON.stringify(body). */
  rawBody?: string;
  params?: Record<string, string>;
}

export async function callRoute(
  route: APIRoute,
  path: string,
  options: CallOptions,
): Promise<{ status: number; body: any }> {
  const hasBody = options.body !== undefined || options.rawBody !== undefined;
  const request = new Request(`http://127.0.0.1${path}`, {
    method: options.method,
    headers: hasBody ? { "content-type": "application/json" } : {},
    body: hasBody ? (options.rawBody ?? JSON.stringify(options.body)) : null,
  });
  const context = {
    request,
    url: new URL(request.url),
    params: options.params ?? {},
    locals: { user: options.user, requestId: "test" },
  };
  const response = await route(context as unknown as APIContext);
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null };
}

export async function countRows(
  table: "assessments" | "regions" | "guidance" | "audit_events" | "models" | "settings",
): Promise<number> {
  const result = await getDb().execute<{ n: number }>(
    sql.raw(`select count(*)::int as n from ${table}`),
  );
  return result.rows[0]?.n ?? -1;
}
