import { describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { guardApi, guardPage } from "@/server/auth/guards";
import { AppError } from "@/server/http/errors";

const forecaster: CurrentUser = {
  id: 4,
  email: "f@desk.example",
  name: "F",
  role: "forecaster",
  organisationId: null,
};
const admin: CurrentUser = { ...forecaster, id: 5, role: "admin" };

function pageContext(user: CurrentUser | null, path: string, signedOutReason?: "deactivated") {
  const calls: string[] = [];
  const context = {
    locals: { user, signedOutReason, requestId: "r" } as App.Locals,
    url: new URL(`http://desk.test${path}`),
    redirect: (to: string, status?: number) => {
      calls.push(`redirect ${status} ${to}`);
      return new Response(null, { status: status ?? 302, headers: { Location: to } });
    },
    rewrite: (to: string) => {
      calls.push(`rewrite ${to}`);
      return Promise.resolve(new Response(null, { status: 403 }));
    },
  };
  return { context: context as unknown as Parameters<typeof guardPage>[0], calls };
}

describe("guardPage", () => {
  it("sends a signed-out visitor to sign-in with 303, keeping where they were going", () => {
    const { context, calls } = pageContext(null, "/admin/users?page=2");
    expect(guardPage(context, "manageUsers").ok).toBe(false);
    expect(calls).toEqual([
      `redirect 303 /sign-in?next=${encodeURIComponent("/admin/users?page=2")}`,
    ]);
  });

  it("tells the sign-in page why a deactivated account was signed out", () => {
    const { context, calls } = pageContext(null, "/", "deactivated");
    guardPage(context, "signedIn");
    expect(calls).toEqual(["redirect 303 /sign-in?next=%2F&reason=deactivated"]);
  });

  it("shows the 403 page to a role the policy excludes", () => {
    const { context, calls } = pageContext(forecaster, "/admin/users");
    expect(guardPage(context, "manageUsers").ok).toBe(false);
    expect(calls).toEqual(["rewrite /403"]);
  });

  it("lets an allowed role through with its user and no redirect", () => {
    const { context, calls } = pageContext(admin, "/admin/users");
    expect(guardPage(context, "manageUsers")).toEqual({ ok: true, user: admin });
    expect(calls).toEqual([]);
  });
});

describe("guardApi", () => {
  const codeOf = (fn: () => unknown) => {
    try {
      fn();
      return "allowed";
    } catch (err) {
      return err instanceof AppError ? err.code : "other";
    }
  };

  it("is UNAUTHORIZED when signed out, FORBIDDEN for the wrong role, and returns the allowed user", () => {
    const locals = (user: CurrentUser | null = null) => ({
      locals: { user, requestId: "r" } as App.Locals,
    });
    expect(codeOf(() => guardApi(locals(), "manageUsers"))).toBe("UNAUTHORIZED");
    expect(codeOf(() => guardApi(locals(forecaster), "manageUsers"))).toBe("FORBIDDEN");
    expect(guardApi(locals(admin), "manageUsers")).toBe(admin);
    expect(guardApi(locals(forecaster), "editAssessments")).toBe(forecaster);
  });
});
