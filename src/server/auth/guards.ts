// The one place that authorises pages and endpoints. Every route calls guardPage or guardApi.
import type { APIContext, AstroGlobal } from "astro";
import { can, type PolicyName } from "@/lib/auth/policies";
import type { CurrentUser } from "@/lib/auth/roles";
import { AppError } from "@/server/http/errors";

type PageContext = Pick<AstroGlobal, "locals" | "url" | "redirect" | "rewrite">;

export type PageGuardResult = { ok: true; user: CurrentUser } | { ok: false; response: Promise<Response> | Response };

/** For .astro pages: signed out → sign-in page; wrong role → the 403 page (status 403). */
export function guardPage(Astro: PageContext, policy: PolicyName): PageGuardResult {
  const user = Astro.locals.user;
  if (!user) {
    const next = encodeURIComponent(Astro.url.pathname + Astro.url.search);
    const reason = Astro.locals.signedOutReason ? `&reason=${Astro.locals.signedOutReason}` : "";
    return { ok: false, response: Astro.redirect(`/sign-in?next=${next}${reason}`, 303) };
  }
  if (!can(user, policy)) return { ok: false, response: Astro.rewrite("/403") };
  return { ok: true, user };
}

/** For endpoints: throws AppError (401 signed out, 403 wrong role), answered as JSON by withApi. */
export function guardApi(context: Pick<APIContext, "locals">, policy: PolicyName): CurrentUser {
  const user = context.locals.user;
  if (!user) throw new AppError("UNAUTHORIZED", "Sign in to use this endpoint.");
  if (!can(user, policy)) throw new AppError("FORBIDDEN", "Your role may not do this.");
  return user;
}

/** Marks a route as deliberately public (sign-in page, health check, signed links). */
export function allowPublic(): null {
  return null;
}
