// Approving a bulletin issues it, all in one transaction: freeze the content, set the issue time
// and approver, supersede the version it corrects, queue deliveries and alerts, and write the
// forecast records verification scores. Two approvals at once: the revision check lets one win.
import { getDb } from "@/db/client";
import { forecastRecords } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { ApproveBulletinData } from "@/lib/schemas/bulletins";
import { recordAudit } from "@/server/audit/audit.db";
import { queueIssuedBulletin } from "@/server/dissemination/queue";
import { AppError } from "@/server/http/errors";
import { fromStoredContent, toStoredContent } from "./content-json";
import {
  findBulletin,
  findLatestIssued,
  listContributorIds,
  updateIfUnchanged,
  type BulletinRow,
} from "./bulletins.db";
import { listGuidanceForDay } from "./day-guidance.db";
import { buildForecastRecords } from "./forecast-records";
import { lostRace, requireSeenRevision, requireTransition } from "./lifecycle";
import { composeLiveContent, supersededTarget } from "./live-content";

export interface IssueResult {
  row: BulletinRow;
  deliveries: number;
  alerts: number;
  forecastRecords: number;
  supersededId: number | null;
}

export async function approveBulletin(
  id: number,
  seen: ApproveBulletinData,
  actor: CurrentUser,
  now = new Date(),
): Promise<IssueResult> {
  const row = await findBulletin(id);
  if (!row) throw new AppError("NOT_FOUND", "No such bulletin.");
  const contributorIds = await listContributorIds(id);
  requireTransition(row.status, "approve", {
    actorId: actor.id,
    authorId: row.authorId,
    contributorIds,
  });
  requireSeenRevision(row.revision, seen.revision);
  const live = await composeLiveContent(row, now);
  if (!live.bulletin || live.problems.length)
    throw new AppError("UNPROCESSABLE_CONTENT", `Cannot issue yet: ${live.problems.join(" ")}`, {
      fields: { content: live.problems.join(" ") },
    });
  if (seen.contentHash && seen.contentHash !== live.contentHash) {
    throw new AppError(
      "CONFLICT",
      "The day's probabilities or text changed since you opened the bulletin: reload and review again.",
      { fields: { contentHash: "Out of date." } },
    );
  }
  const issued = live.bulletin;
  const target = await supersededTarget(row);
  // What recipients had before: the version corrected, else the latest bulletin in force.
  const previousRow = target ?? (await findLatestIssued(id));
  const previous = previousRow?.content ? fromStoredContent(previousRow.content) : null;
  const stored = await listGuidanceForDay(row.forecastDay);
  const records = buildForecastRecords(issued, stored);

  return getDb().transaction(async (tx) => {
    const updated = await updateIfUnchanged(
      tx,
      id,
      { revision: row.revision, status: "in_review" },
      {
        status: "issued",
        content: toStoredContent(issued),
        issueTime: now,
        approverId: actor.id,
        isDemo: issued.isDemo,
      },
    );
    if (!updated)
      throw new AppError(
        "CONFLICT",
        "This bulletin was issued or changed by someone else a moment ago: reload to see it.",
      );
    if (target) {
      const superseded = await updateIfUnchanged(
        tx,
        target.id,
        { revision: target.revision, status: "issued" },
        { status: "superseded" },
      );
      if (!superseded) throw lostRace();
      await recordAudit(
        {
          actor: { id: actor.id, email: actor.email },
          action: "bulletin.superseded",
          targetType: "bulletin",
          targetId: target.id,
          details: { version: target.version, supersededBy: id, supersededByVersion: row.version },
        },
        tx,
      );
    }
    if (records.length) await tx.insert(forecastRecords).values(records);
    const queued = await queueIssuedBulletin(tx, issued, previous, now);
    await recordAudit(
      {
        actor: { id: actor.id, email: actor.email },
        action: "bulletin.approved_issued",
        targetType: "bulletin",
        targetId: id,
        details: {
          day: row.forecastDay,
          version: row.version,
          issueTime: now.toISOString(),
          supersedes: target?.id ?? null,
          deliveries: queued.deliveries,
          alerts: queued.alerts,
          forecastRecords: records.length,
        },
      },
      tx,
    );
    return {
      row: updated,
      deliveries: queued.deliveries,
      alerts: queued.alerts,
      forecastRecords: records.length,
      supersededId: target?.id ?? null,
    };
  });
}
