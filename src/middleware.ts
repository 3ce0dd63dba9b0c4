// Authenticates each request into locals.user, adds security headers and refuses oversized bodies
// and throttled sign-ins. Authorisation itself lives in src/server/auth/guards.ts.
import { defineMiddleware } from "astro:middleware";
import { randomUUID } from "node:crypto";
import { isDatabaseOpen, openDatabase } from "@/db/client";
import { lookUpCurrentUser } from "@/server/auth/session";
import { checkSignInThrottle } from "@/server/auth/throttle";
import { readConfig } from "@/server/config";
import { AppError, errorResponse } from "@/server/http/errors";
import { runWithRequestFacts } from "@/server/http/request-context";
import { applySecurityHeaders } from "@/server/http/security-headers";

const MAX_BODY_BYTES = 12 * 1024 * 1024;
const SIGN_IN_CALLBACK = "/api/auth/callback/credentials";
// The actions Auth.js answers; anything else under /api/auth would reach its handler as no response.
const AUTH_ACTIONS = new Set(["session", "csrf", "providers", "signin", "signout", "callback", "verify-request", "error", "webauthn-options"]);

export const onRequest = defineMiddleware(async (context, next) => {
  if (!isDatabaseOpen()) await openDatabase({ location: `${readConfig().dataDir}/pgdata` });
  const requestId = randomUUID();
  let ip = "unknown";
  try {
    ip = context.clientAddress;
  } catch {
    // Prerendered or synthetic requests have no client address.
  }
  context.locals.requestId = requestId;
  return runWithRequestFacts({ ip, requestId }, async () => {
    const declared = Number(context.request.headers.get("content-length") ?? "0");
    if (declared > MAX_BODY_BYTES) {
      const refused = applySecurityHeaders(errorResponse(new AppError("PAYLOAD_TOO_LARGE", "The request body is too large.")));
      // The unread body would otherwise poison the next request on this keep-alive connection.
      refused.headers.set("Connection", "close");
      return refused;
    }
    const authAction = /^\/api\/auth\/([^/]+)/.exec(context.url.pathname)?.[1];
    if (authAction !== undefined && !AUTH_ACTIONS.has(authAction)) {
      return applySecurityHeaders(errorResponse(new AppError("NOT_FOUND", "No such sign-in action.")));
    }
    if (context.request.method === "POST" && context.url.pathname === SIGN_IN_CALLBACK) {
      const refused = await refuseThrottledSignIn(context.request, ip);
      if (refused) return applySecurityHeaders(refused);
    }
    const session = await lookUpCurrentUser(context.request);
    context.locals.user = session.user;
    context.locals.signedOutReason = session.user ? undefined : session.reason;
    const response = await next();
    return applySecurityHeaders(response);
  });
});

async function refuseThrottledSignIn(request: Request, ip: string): Promise<Response | null> {
  let email = "";
  try {
    const form = await request.clone().formData();
    email = String(form.get("email") ?? "");
  } catch {
    return errorResponse(new AppError("BAD_REQUEST", "Send the sign-in form as form data."));
  }
  const decision = await checkSignInThrottle(email, ip, new Date());
  if (decision.allowed) return null;
  const minutes = Math.ceil(decision.retryAfterSeconds / 60);
  return errorResponse(
    new AppError("TOO_MANY_REQUESTS", `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`, {
      retryAfterSeconds: decision.retryAfterSeconds,
    }),
  );
}
