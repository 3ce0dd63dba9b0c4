import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES } from "@/lib/auth/roles";
import { demoAccount } from "../support/demo-accounts";
import { isSignedIn, signInOverHttp } from "../support/http-session";
import { removeDataDir, seededDataDir } from "../support/seeded-data-dir";
import { startServer, type RunningServer } from "../support/server";
import { CALLERS, type Caller, type Probe } from "../support/route-probes";
import {
  isPathOfRoute,
  listBuiltRoutes,
  listRouteFiles,
  type Method,
} from "../support/route-files";
import { ROUTE_TABLE } from "./route-matrix.table";

const files = listRouteFiles(path.resolve("src/pages"));
const entries = Object.entries(ROUTE_TABLE);
const probes = entries.flatMap(([route, entry]) =>
  (Object.entries(entry.methods) as [Method, Probe][]).map(([method, probe]) => ({
    route,
    kind: entry.kind,
    method,
    probe,
  })),
);

describe("the route table is complete", () => {
  it("has an entry for every route file under src/pages", () => {
    expect(files.length).toBeGreaterThan(20);
    expect(files.filter((f) => !ROUTE_TABLE[f.route]).map((f) => `${f.file} → ${f.route}`)).toEqual(
      [],
    );
  });

  it("has a file for every entry that no integration injects", () => {
    const routes = new Set(files.map((f) => f.route));
    expect(
      entries.filter(([route, e]) => !e.injectedBy && !routes.has(route)).map(([route]) => route),
    ).toEqual([]);
  });

  it("has an entry for every route of the built server, injected ones included", () => {
    // The built route list spells parameter names in lower case ([thresholdId] → [thresholdid]).
    const built = listBuiltRoutes(path.resolve("dist/server"));
    const known = new Set(entries.map(([route]) => route.toLowerCase()));
    expect(built.filter((route) => !known.has(route.toLowerCase()))).toEqual([]);
    expect(
      entries
        .filter(([route, e]) => e.injectedBy && !built.includes(route.toLowerCase()))
        .map(([route]) => route),
    ).toEqual([]);
  });

  it("probes exactly the methods each file exports", () => {
    const mismatched = files
      .filter((f) => ROUTE_TABLE[f.route])
      .map((f) => ({
        route: f.route,
        exported: f.methods,
        probed: Object.keys(ROUTE_TABLE[f.route]?.methods ?? {}).sort(),
      }))
      .filter((m) => m.exported.slice().sort().join() !== m.probed.join());
    expect(mismatched).toEqual([]);
  });

  it("uses a sample path that fits each route pattern", () => {
    expect(
      probes
        .filter((p) => !isPathOfRoute(p.probe.path, p.route))
        .map((p) => `${p.route}: ${p.probe.path}`),
    ).toEqual([]);
  });
});

describe("every route answers every role as the table says", () => {
  let server: RunningServer;
  const callers = new Map<Caller, (path: string, init?: RequestInit) => Promise<Response>>();

  beforeAll(async () => {
    server = await startServer({ dataDir: await seededDataDir("route-matrix") });
    const base = server.baseUrl;
    callers.set("anonymous", (p, init = {}) =>
      fetch(`${base}${p}`, {
        redirect: "manual",
        ...init,
        headers: { Origin: base, ...(init.headers ?? {}) },
      }),
    );
    for (const role of ROLES) {
      const { email, password } = demoAccount(role);
      const { status, session } = await signInOverHttp(base, email, password);
      if (!isSignedIn(session)) throw new Error(`${role} could not sign in (${status})`);
      callers.set(role, session.fetch);
    }
  });
  afterAll(async () => {
    await server?.stop();
    removeDataDir(server?.dataDir);
  });

  it("has a session with the right role for every demo role, and none for the anonymous caller", async () => {
    const seen: Record<string, unknown> = {};
    for (const caller of CALLERS) {
      const res = await callers.get(caller)!("/api/auth/session");
      seen[caller] =
        ((await res.json()) as { user?: { role?: string } } | null)?.user?.role ?? null;
    }
    expect(seen).toEqual({ anonymous: null, ...Object.fromEntries(ROLES.map((r) => [r, r])) });
  });

  it.each(probes)("$method $route", async ({ kind, method, probe }) => {
    const expected: Record<string, string> = {};
    const actual: Record<string, string> = {};
    for (const caller of CALLERS) {
      const init: RequestInit =
        probe.body === undefined
          ? { method }
          : { method, body: probe.body, headers: { "Content-Type": "application/json" } };
      const res = await callers.get(caller)!(probe.path, init);
      const text = await res.text();
      actual[caller] = describeAnswer(res, text, kind);
      expected[caller] = describeExpected(probe, caller, kind);
    }
    expect(actual).toEqual(expected);
  });
});

// The guard's own refusal message (src/server/auth/guards.ts); a route may refuse for other reasons.
const ROLE_REFUSAL = "Your role may not do this.";
const PAGE_403 = /This page is not part of your role(&#39;|')s work/;

/** One comparable line per answer: status, redirect target, and who refused. */
function describeAnswer(res: Response, text: string, kind: "page" | "api"): string {
  if (res.status === 303) {
    return `303 → ${res.headers.get("location")?.replace(/^https?:\/\/[^/]+/, "")}`;
  }
  if (kind === "api" && res.status === 401) return `401 ${errorOf(text).code}`;
  if (res.status === 403) {
    const isGuard = kind === "api" ? errorOf(text).message === ROLE_REFUSAL : PAGE_403.test(text);
    return isGuard ? "403 refused by role" : "403 refused by the route";
  }
  return String(res.status);
}

function describeExpected(probe: Probe, caller: Caller, kind: "page" | "api"): string {
  const status = probe.status[caller];
  if (status === 303) return `303 → ${probe.location?.[caller]}`;
  if (kind === "api" && status === 401) return "401 UNAUTHORIZED";
  if (status === 403) {
    const isRefused = (probe.refused ?? []).includes(caller);
    return isRefused ? "403 refused by role" : "403 refused by the route";
  }
  return String(status);
}

function errorOf(text: string): { code?: string; message?: string } {
  try {
    return (JSON.parse(text) as { error?: { code?: string; message?: string } }).error ?? {};
  } catch {
    return { message: `not JSON: ${text.slice(0, 60)}` };
  }
}
