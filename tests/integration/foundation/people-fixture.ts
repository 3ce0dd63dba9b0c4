// Inserts people straight into the test database, so each test starts from known accounts.
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, invitations, users } from "@/db/schema";
import type { CurrentUser, Role } from "@/lib/auth/roles";
import { hashPassword } from "@/server/auth/passwords";

export interface PersonSpec {
  email: string;
  role: Role;
  name?: string;
  password?: string;
  isActive?: boolean;
}

export async function insertPerson(spec: PersonSpec): Promise<CurrentUser> {
  const [row] = await getDb()
    .insert(users)
    .values({
      email: spec.email,
      name: spec.name ?? "Test Person",
      role: spec.role,
      passwordHash: spec.password ? await hashPassword(spec.password) : null,
      isActive: spec.isActive ?? true,
    })
    .returning();
  if (!row) throw new Error("no user row");
  return { id: row.id, email: row.email, name: row.name, role: row.role, organisationId: null };
}

export async function readUser(id: number) {
  const [row] = await getDb().select().from(users).where(eq(users.id, id));
  return row;
}

export async function readInvitations(userId: number) {
  return getDb()
    .select()
    .from(invitations)
    .where(eq(invitations.userId, userId))
    .orderBy(invitations.id);
}

export async function readAuditActions(targetId: number | string): Promise<string[]> {
  const rows = await getDb()
    .select({ action: auditEvents.action })
    .from(auditEvents)
    .where(eq(auditEvents.targetId, String(targetId)))
    .orderBy(auditEvents.id);
  return rows.map((r) => r.action);
}

/** The accept link's token from an invitation e-mail's plain-text part. */
export function tokenFromMail(text: string | null | undefined): string {
  const match = /\/invitations\/accept\?token=(\S+)/.exec(text ?? "");
  if (!match?.[1]) throw new Error(`no accept link in:\n${text}`);
  return decodeURIComponent(match[1]);
}
