// Use cases of a bulletin's review: edit the discussion, submit, return with a comment, reopen,
// and withdraw an issued one. Each is one transaction with its audit row; the state machine
// decides what is legal.
import { getDb, type Tx } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import type { BulletinState } from "@/lib/domain/bulletin-states";
import type {
  EditBulletinData,
  ReturnBulletinData,
  WithdrawBulletinData,
} from "@/lib/schemas/bulletins";
import { recordAudit } from "@/server/audit/audit.db";
import { cancelQueuedDeliveries } from "@/server/dissemination/outbox.db";
import { AppError } from "@/server/http/errors";
import {
  insertComment,
  updateIfUnchanged,
  type BulletinChange,
  type BulletinRow,
} from "./bulletins.db";
import {
  actorOf,
  lostRace,
  requireBulletin,
  requireSeenRevision,
  requireTransition,
} from "./lifecycle";
import { composeLiveContent } from "./live-content";

export async function editBulletin(
  id: number,
  data: EditBulletinData,
  actor: CurrentUser,
): Promise<BulletinRow> {
  const row = await requireBulletin(id);
  const next = requireTransition(row.status, "edit", { actorId: actor.id, authorId: row.authorId });
  requireSeenRevision(row.revision, data.revision);
  return getDb().transaction(async (tx) => {
    const updated = await updateIfUnchanged(tx, id, row, {
      discussion: data.discussion,
      status: next,
    });
    if (!updated) throw lostRace();
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "bulletin.edited",
        targetType: "bulletin",
        targetId: id,
        details: { fields: ["discussion"], from: row.status, to: next },
      },
      tx,
    );
    return updated;
  });
}

export async function submitBulletin(
  id: number,
  actor: CurrentUser,
  now = new Date(),
): Promise<BulletinRow> {
  const row = await requireBulletin(id);
  const next = requireTransition(row.status, "submit", {
    actorId: actor.id,
    authorId: row.authorId,
  });
  const { problems } = await composeLiveContent(row, now);
  if (problems.length)
    throw new AppError("UNPROCESSABLE_CONTENT", `Not ready for review: ${problems.join(" ")}`, {
      fields: { content: problems.join(" ") },
    });
  return step(
    row,
    next,
    actor,
    { submittedAt: now },
    { action: "bulletin.submitted", details: {} },
  );
}

export async function returnBulletin(
  id: number,
  data: ReturnBulletinData,
  actor: CurrentUser,
): Promise<BulletinRow> {
  const row = await requireBulletin(id);
  const next = requireTransition(row.status, "return", {
    actorId: actor.id,
    authorId: row.authorId,
    comment: data.comment,
  });
  return step(
    row,
    next,
    actor,
    {},
    { action: "bulletin.returned", details: { comment: data.comment } },
    (tx) => insertComment(tx, row.id, actor.id, data.comment),
  );
}

export async function reopenBulletin(id: number, actor: CurrentUser): Promise<BulletinRow> {
  const row = await requireBulletin(id);
  const next = requireTransition(row.status, "reopen", {
    actorId: actor.id,
    authorId: row.authorId,
  });
  return step(row, next, actor, {}, { action: "bulletin.reopened", details: {} });
}

export async function withdrawBulletin(
  id: number,
  data: WithdrawBulletinData,
  actor: CurrentUser,
): Promise<BulletinRow> {
  const row = await requireBulletin(id);
  const next = requireTransition(row.status, "withdraw", {
    actorId: actor.id,
    authorId: row.authorId,
    reason: data.reason,
  });
  return step(
    row,
    next,
    actor,
    { withdrawnReason: data.reason },
    { action: "bulletin.withdrawn", details: { reason: data.reason } },
    // E-mails of the bulletin not yet handed to the provider must not go out after withdrawal.
    async (tx) => ({
      cancelledDeliveries: await cancelQueuedDeliveries(tx, row.id, "the bulletin was withdrawn"),
    }),
  );
}

async function step(
  row: BulletinRow,
  next: BulletinState,
  actor: CurrentUser,
  change: BulletinChange,
  audit: { action: string; details: Record<string, unknown> },
  /** More work in the same transaction; what it answers is added to the audit details. */
  alsoDo?: (tx: Tx) => Promise<Record<string, unknown> | void>,
): Promise<BulletinRow> {
  return getDb().transaction(async (tx) => {
    const updated = await updateIfUnchanged(tx, row.id, row, { ...change, status: next });
    if (!updated) throw lostRace();
    const extra = (await alsoDo?.(tx)) ?? {};
    await recordAudit(
      {
        actor: actorOf(actor),
        action: audit.action,
        targetType: "bulletin",
        targetId: row.id,
        details: { ...audit.details, ...extra, version: row.version, from: row.status, to: next },
      },
      tx,
    );
    return updated;
  });
}
