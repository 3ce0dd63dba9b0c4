// The only module that talks to the auth library: turns a request's session into our CurrentUser,
// re-reading the account so a role change or deactivation takes effect on the next request.
import { getSession } from "auth-astro/server";
import type { CurrentUser } from "@/lib/auth/roles";
import { findUserById } from "@/server/users/users.db";

export type SessionLookup = { user: CurrentUser } | { user: null; reason?: "deactivated" };

export async function lookUpCurrentUser(request: Request): Promise<SessionLookup> {
  const session = await getSession(request).catch(() => null);
  const id = Number((session?.user as { id?: unknown } | undefined)?.id);
  if (!Number.isInteger(id) || id <= 0) return { user: null };
  const row = await findUserById(id);
  if (!row) return { user: null };
  if (!row.isActive) return { user: null, reason: "deactivated" };
  return {
    user: { id: row.id, email: row.email, name: row.name, role: row.role, organisationId: row.organisationId },
  };
}
