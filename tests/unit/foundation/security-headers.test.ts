import { describe, expect, it } from "vitest";
import { applySecurityHeaders } from "@/server/http/security-headers";

/** Parses a CSP header into directive → sources (W3C CSP Level 3 §2.2 syntax). */
function directives(csp: string | null): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const part of (csp ?? "").split(";")) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out[name] = sources;
  }
  return out;
}

describe("security headers", () => {
  it("adds CSP with frame-ancestors 'none', nosniff, a referrer policy and frame refusal", () => {
    const response = applySecurityHeaders(
      new Response("<p>hi</p>", { headers: { "Content-Type": "text/html" } }),
    );
    const csp = directives(response.headers.get("Content-Security-Policy"));
    expect(csp["frame-ancestors"]).toEqual(["'none'"]);
    expect(csp["default-src"]).toEqual(["'self'"]);
    expect(csp["object-src"]).toEqual(["'none'"]);
    expect(csp["form-action"]).toEqual(["'self'"]);
    expect(response.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(response.headers.get("Referrer-Policy")).toBe("same-origin");
    expect(response.headers.get("X-Frame-Options")).toBe("DENY");
  });

  it("keeps a stricter policy a route set for itself", () => {
    const own = "default-src 'none'; frame-ancestors 'self'";
    const response = applySecurityHeaders(
      new Response("x", {
        headers: { "Content-Security-Policy": own, "X-Frame-Options": "SAMEORIGIN" },
      }),
    );
    expect(response.headers.get("Content-Security-Policy")).toBe(own);
    expect(response.headers.get("X-Frame-Options")).toBe("SAMEORIGIN");
    expect(response.headers.get("X-Content-Type-Options")).toBe("nosniff");
  });

  it("copies a response whose headers are immutable, keeping status and location", () => {
    const redirect = Response.redirect("http://desk.test/sign-in", 303);
    expect(() => redirect.headers.set("X-Probe", "1")).toThrow();
    const secured = applySecurityHeaders(redirect);
    expect(secured.status).toBe(303);
    expect(secured.headers.get("Location")).toBe("http://desk.test/sign-in");
    expect(secured.headers.get("X-Content-Type-Options")).toBe("nosniff");
  });

  it("changes nothing else about the response", async () => {
    const response = applySecurityHeaders(new Response("body text", { status: 418 }));
    expect(response.status).toBe(418);
    expect(await response.text()).toBe("body text");
  });
});
