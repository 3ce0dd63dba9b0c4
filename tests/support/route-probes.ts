// Builds the expected answers of the route matrix: who is refused how, and what an allowed
// caller gets for a harmless probe (a dummy id, an empty body), per route and method.
import { ROLES, type Role } from "@/lib/auth/roles";
import type { Method } from "./route-files";

export const CALLERS = ["anonymous", ...ROLES] as const;
export type Caller = (typeof CALLERS)[number];

export interface Probe {
  /** A concrete address matching the route; ids are dummies that match no row. */
  path: string;
  /** JSON sent with a mutating method: empty, so that nothing is changed. */
  body?: string;
  status: Record<Caller, number>;
  /** Roles the guard itself refuses (as opposed to a 403 the route gives for its own reasons). */
  refused?: readonly Caller[];
  /** The exact Location of each 303 answer. */
  location?: Partial<Record<Caller, string>>;
}

export interface RouteEntry {
  kind: "page" | "api";
  /** Routes added by an integration rather than by a file under src/pages. */
  injectedBy?: string;
  methods: Partial<Record<Method, Probe>>;
}

const EMPTY_BODY = "{}";

export function statuses(allowed: readonly Role[], ok: number, denied: number, anonymous: number) {
  const out = { anonymous } as Record<Caller, number>;
  for (const role of ROLES) out[role] = allowed.includes(role) ? ok : denied;
  return out;
}

/** The roles not in the list. */
export function others(allowed: readonly Role[]): Role[] {
  return ROLES.filter((r) => !allowed.includes(r));
}

/** The same Location for every role in the list. */
export function locationFor(roles: readonly Role[], to: string): Partial<Record<Caller, string>> {
  return Object.fromEntries(roles.map((r) => [r, to]));
}

/** A guarded page: signed out → 303 to sign-in with the way back, wrong role → the 403 page. */
export function pageRoute(path: string, allowed: readonly Role[], ok = 200): RouteEntry {
  const location = { anonymous: `/sign-in?next=${encodeURIComponent(path)}` };
  const status = statuses(allowed, ok, 403, 303);
  return { kind: "page", methods: { GET: { path, status, refused: others(allowed), location } } };
}

/** A page everyone gets alike (error pages, signed links). */
export function openPage(path: string, status: number, refused?: readonly Caller[]): RouteEntry {
  const probe = { path, status: statuses(ROLES, status, status, status) };
  return { kind: "page", methods: { GET: refused ? { ...probe, refused } : probe } };
}

/**
 * A guarded endpoint: signed out → 401, wrong role → 403 (both JSON errors), allowed → the given
 * status. Mutating methods get an empty JSON body.
 */
export function apiRoute(
  path: string,
  methods: Partial<Record<Method, [allowed: readonly Role[], ok: number]>>,
): RouteEntry {
  const out: RouteEntry["methods"] = {};
  for (const [method, [allowed, ok]] of Object.entries(methods) as [Method, [Role[], number]][]) {
    const probe = { path, status: statuses(allowed, ok, 403, 401), refused: others(allowed) };
    out[method] = method === "GET" ? probe : { ...probe, body: EMPTY_BODY };
  }
  return { kind: "api", methods: out };
}

/** A public endpoint: the same answer for everybody. */
export function openApi(path: string, method: Method, status: number): Probe {
  const probe = { path, status: statuses(ROLES, status, status, status) };
  return method === "GET" ? probe : { ...probe, body: EMPTY_BODY };
}
