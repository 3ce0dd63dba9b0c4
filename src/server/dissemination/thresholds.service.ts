// Owns adding, changing and removing a contact's alert thresholds (one per level and window),
// each change audited with who made it and from where (desk or portal).
import { and, eq, ne } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { alertThresholds, contacts } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { ThresholdInput } from "@/lib/schemas/subscriptions";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import type { ThresholdItem } from "./contacts.db";

export type ThresholdSource = "desk" | "portal" | "import";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

export function toStoredThreshold(input: ThresholdInput) {
  return {
    level: input.level,
    windowHours: input.windowHours,
    probability: input.probabilityPercent / 100,
  };
}

async function requireNoTwin(
  db: Db | Tx,
  contactId: number,
  input: ThresholdInput,
  exceptId?: number,
): Promise<void> {
  const same = and(
    eq(alertThresholds.contactId, contactId),
    eq(alertThresholds.level, input.level),
    eq(alertThresholds.windowHours, input.windowHours),
  );
  const [twin] = await db
    .select({ id: alertThresholds.id })
    .from(alertThresholds)
    .where(exceptId ? and(same, ne(alertThresholds.id, exceptId)) : same);
  if (twin) {
    throw new AppError(
      "CONFLICT",
      `There is already a threshold for ${input.level} within ${input.windowHours} h: change that one instead.`,
      { fields: { level: "Already set for this window." } },
    );
  }
}

export async function findThreshold(id: number, db: Db | Tx = getDb()) {
  const [row] = await db.select().from(alertThresholds).where(eq(alertThresholds.id, id));
  return row ?? null;
}

export async function addThreshold(
  contactId: number,
  input: ThresholdInput,
  actor: CurrentUser,
  via: ThresholdSource,
): Promise<ThresholdItem> {
  return getDb().transaction(async (tx) => {
    const [contact] = await tx
      .select({ id: contacts.id })
      .from(contacts)
      .where(eq(contacts.id, contactId));
    if (!contact) throw new AppError("NOT_FOUND", "No such contact.");
    await requireNoTwin(tx, contactId, input);
    const [row] = await tx
      .insert(alertThresholds)
      .values({ contactId, ...toStoredThreshold(input) })
      .returning();
    if (!row) throw new Error("threshold insert returned nothing");
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "threshold.added",
        targetType: "contact",
        targetId: contactId,
        details: { via, thresholdId: row.id, ...toStoredThreshold(input) },
      },
      tx,
    );
    return {
      id: row.id,
      level: row.level,
      windowHours: row.windowHours,
      probability: row.probability,
    };
  });
}

/** `contactId` is the contact the caller may act for; a threshold of any other contact is refused. */
export async function changeThreshold(
  contactId: number,
  thresholdId: number,
  input: ThresholdInput,
  actor: CurrentUser,
  via: ThresholdSource,
): Promise<ThresholdItem> {
  return getDb().transaction(async (tx) => {
    const before = await findThreshold(thresholdId, tx);
    if (!before || before.contactId !== contactId)
      throw new AppError("NOT_FOUND", "No such threshold for this contact.");
    await requireNoTwin(tx, contactId, input, thresholdId);
    const [row] = await tx
      .update(alertThresholds)
      .set(toStoredThreshold(input))
      .where(eq(alertThresholds.id, thresholdId))
      .returning();
    if (!row) throw new Error("threshold update returned nothing");
    const was = {
      level: before.level,
      windowHours: before.windowHours,
      probability: before.probability,
    };
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "threshold.changed",
        targetType: "contact",
        targetId: contactId,
        details: { via, thresholdId, before: was, after: toStoredThreshold(input) },
      },
      tx,
    );
    return {
      id: row.id,
      level: row.level,
      windowHours: row.windowHours,
      probability: row.probability,
    };
  });
}

export async function removeThreshold(
  contactId: number,
  thresholdId: number,
  actor: CurrentUser,
  via: ThresholdSource,
): Promise<void> {
  await getDb().transaction(async (tx) => {
    const before = await findThreshold(thresholdId, tx);
    if (!before || before.contactId !== contactId)
      throw new AppError("NOT_FOUND", "No such threshold for this contact.");
    await tx.delete(alertThresholds).where(eq(alertThresholds.id, thresholdId));
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "threshold.removed",
        targetType: "contact",
        targetId: contactId,
        details: {
          via,
          thresholdId,
          level: before.level,
          windowHours: before.windowHours,
          probability: before.probability,
        },
      },
      tx,
    );
  });
}
