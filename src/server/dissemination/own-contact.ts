// Owns finding the contact that belongs to a signed-in subscriber: linked by user id, or by the
// same e-mail address (then linked, so a later change of address keeps the link).
import { and, eq, isNull, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { contacts } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";

export type ContactRow = typeof contacts.$inferSelect;

export async function findOwnContact(
  user: CurrentUser,
  db: Db | Tx = getDb(),
): Promise<ContactRow | null> {
  if (user.role !== "subscriber") return null;
  const [linked] = await db.select().from(contacts).where(eq(contacts.userId, user.id)).limit(1);
  if (linked) return linked;
  const [byEmail] = await db
    .update(contacts)
    .set({ userId: user.id })
    .where(
      and(
        sql`lower(${contacts.email}) = ${user.email.trim().toLowerCase()}`,
        isNull(contacts.userId),
      ),
    )
    .returning();
  return byEmail ?? null;
}
