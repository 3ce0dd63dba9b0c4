// Calls verification endpoints in-process as a given user, and counts rows of the tables they write.
import type { APIContext, APIRoute } from "astro";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";

export async function createPerson(role: CurrentUser["role"], email: string): Promise<CurrentUser> {
  const [row] = await getDb()
    .insert(users)
    .values({ email, name: `Test ${role}`, role })
    .returning();
  if (!row) throw new Error("user insert returned nothing");
  return { id: row.id, email: row.email, name: row.name, role: row.role, organisationId: null };
}

export interface Call {
  method?: string;
  user: CurrentUser | null;
  body?: unknown;
  rawBody?: string;
  params?: Record<string, string>;
}

export async function callRaw(route: APIRoute, path: string, call: Call): Promise<Response> {
  const hasBody = call.body !== undefined || call.rawBody !== undefined;
  const request = new Request(`http://127.0.0.1${path}`, {
    method: call.method ?? "GET",
    headers: hasBody ? { "content-type": "application/json" } : {},
    body: hasBody ? (call.rawBody ?? JSON.stringify(call.body)) : null,
  });
  const context = {
    request,
    url: new URL(request.url),
    params: call.params ?? {},
    locals: { user: call.user, requestId: "test" },
  };
  return route(context as unknown as APIContext);
}

export async function callJson(
  route: APIRoute,
  path: string,
  call: Call,
): Promise<{ status: number; body: any }> {
  const res = await callRaw(route, path, call);
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

const TABLES = [
  "event_lists",
  "flare_events",
  "external_series",
  "forecast_records",
  "calibration_proposals",
  "models",
  "audit_events",
] as const;

export async function countTables(): Promise<Record<(typeof TABLES)[number], number>> {
  const out = {} as Record<(typeof TABLES)[number], number>;
  for (const t of TABLES) {
    const result = await getDb().execute<{ n: number }>(
      sql.raw(`select count(*)::int as n from ${t}`),
    );
    out[t] = result.rows[0]?.n ?? -1;
  }
  return out;
}
