// Response headers every answer carries (CSP with frame-ancestors, nosniff, referrer policy).
const CSP = [
  "default-src 'self'",
  // Astro's island loader is an inline script; everything else is same-origin.
  "script-src 'self' 'unsafe-inline'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data:",
  "font-src 'self' data:",
  "connect-src 'self'",
  "form-action 'self'",
  "base-uri 'self'",
  "object-src 'none'",
  "frame-ancestors 'none'",
].join("; ");

export function applySecurityHeaders(response: Response): Response {
  const set = (name: string, value: string) => {
    if (!response.headers.has(name)) response.headers.set(name, value);
  };
  try {
    set("Content-Security-Policy", CSP);
    set("X-Content-Type-Options", "nosniff");
    set("Referrer-Policy", "same-origin");
    set("X-Frame-Options", "DENY");
    set("Cross-Origin-Opener-Policy", "same-origin");
  } catch {
    // Some responses (e.g. redirects built by fetch) have immutable headers: copy them.
    const copy = new Response(response.body, response);
    return applySecurityHeaders(copy);
  }
  return response;
}
