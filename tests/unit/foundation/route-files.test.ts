import { describe, expect, it } from "vitest";
import { exportedMethods, isPathOfRoute, routeOfFile } from "../../support/route-files";

// Astro's file-based routing (Astro docs, "Routing"): index files name their folder, the last
// extension goes, [param] is one segment and [...rest] any number of them.
describe("route files of the route matrix", () => {
  it.each([
    ["index.astro", "/"],
    ["sign-in.astro", "/sign-in"],
    ["api/admin/users/index.ts", "/api/admin/users"],
    ["api/admin/users/[id]/index.ts", "/api/admin/users/[id]"],
    ["admin/mailbox/[id].html.ts", "/admin/mailbox/[id].html"],
    ["reindex.astro", "/reindex"],
  ])("maps %s to %s", (file, route) => {
    expect(routeOfFile(file)).toBe(route);
  });

  it("reads the HTTP methods an endpoint exports, in any export form", () => {
    const source =
      "export const GET = a;\nexport async function PATCH() {}\nexport function helper() {}";
    expect(exportedMethods(source, "x.ts")).toEqual(["GET", "PATCH"]);
    expect(exportedMethods("export const { GET, POST } = AstroAuth()", "x.ts")).toEqual([
      "GET",
      "POST",
    ]);
    expect(exportedMethods("const PUT = 1;\nexport { PUT as DELETE };", "x.ts")).toEqual([
      "DELETE",
    ]);
    expect(exportedMethods("const DELETE = 1;", "x.ts")).toEqual([]);
  });

  it("treats a page as answering GET, and the methods its frontmatter handles", () => {
    expect(exportedMethods("---\nconst POST = 1;\n---", "page.astro")).toEqual(["GET"]);
    const form = '---\nif (Astro.request.method === "POST") {}\n---';
    expect(exportedMethods(form, "page.astro")).toEqual(["GET", "POST"]);
  });

  it("matches sample paths to patterns, segment by segment", () => {
    expect(isPathOfRoute("/api/admin/users/9/invitation", "/api/admin/users/[id]/invitation")).toBe(
      true,
    );
    expect(
      isPathOfRoute("/api/admin/users/9/x/invitation", "/api/admin/users/[id]/invitation"),
    ).toBe(false);
    expect(isPathOfRoute("/api/auth/callback/credentials", "/api/auth/[...auth]")).toBe(true);
    expect(isPathOfRoute("/admin/mailbox/abc.html?x=1", "/admin/mailbox/[id].html")).toBe(true);
    expect(isPathOfRoute("/admin/mailbox/abcXhtml", "/admin/mailbox/[id].html")).toBe(false);
  });
});
