// What one bulletin looks like to one reader: who may see it, its content (frozen or live), the
// review comments, and the actions that reader may take next.
import { can } from "@/lib/auth/policies";
import type { CurrentUser } from "@/lib/auth/roles";
import {
  availableActions,
  isPublishedState,
  type BulletinAction,
} from "@/lib/domain/bulletin-states";
import type { BulletinDetail, BulletinListResponse } from "@/lib/query/bulletins";
import type { BulletinListQuery } from "@/lib/schemas/bulletins";
import { AppError } from "@/server/http/errors";
import { findSummary, listBulletins, PUBLISHED_STATES } from "./bulletin-lists.db";
import { findBulletin, listComments, listContributorIds, type BulletinRow } from "./bulletins.db";
import { toStoredContent } from "./content-json";
import { readBulletinContent, type BulletinContentState } from "./live-content";

const REVIEW_ACTIONS: readonly BulletinAction[] = ["return", "approve", "withdraw"];

/** Subscribers (and anyone without readDraftBulletins) see published bulletins only: 403 otherwise. */
export async function requireReadableBulletin(
  id: number,
  viewer: CurrentUser,
): Promise<BulletinRow> {
  const row = await findBulletin(id);
  if (!row) throw new AppError("NOT_FOUND", "No such bulletin.");
  if (!isPublishedState(row.status) && !can(viewer, "readDraftBulletins"))
    throw new AppError("FORBIDDEN", "This bulletin is not issued yet.");
  return row;
}

export async function actionsFor(row: BulletinRow, viewer: CurrentUser): Promise<BulletinAction[]> {
  const contributorIds = await listContributorIds(row.id);
  return availableActions(row.status, {
    actorId: viewer.id,
    authorId: row.authorId,
    contributorIds,
  }).filter((action) =>
    can(viewer, REVIEW_ACTIONS.includes(action) ? "reviewBulletins" : "draftBulletins"),
  );
}

export async function describeBulletin(
  row: BulletinRow,
  viewer: CurrentUser,
  content: BulletinContentState,
): Promise<BulletinDetail> {
  const [summary, comments, actions] = await Promise.all([
    findSummary(row.id),
    listComments(row.id),
    actionsFor(row, viewer),
  ]);
  if (!summary) throw new AppError("NOT_FOUND", "No such bulletin.");
  return {
    ...summary,
    discussion: row.discussion,
    withdrawnReason: row.withdrawnReason,
    content: content.bulletin ? toStoredContent(content.bulletin) : null,
    problems: content.problems,
    contentHash: content.contentHash,
    comments: comments.map((c) => ({
      authorName: c.authorName,
      body: c.body,
      createdAt: c.createdAt.toISOString(),
    })),
    actions,
  };
}

export async function getBulletinDetail(
  id: number,
  viewer: CurrentUser,
  now = new Date(),
): Promise<BulletinDetail> {
  const row = await requireReadableBulletin(id, viewer);
  return describeBulletin(row, viewer, await readBulletinContent(row, now));
}

/** The desk's list; readers without readDraftBulletins get published bulletins only (403 if they ask for drafts). */
export async function listBulletinsFor(
  viewer: CurrentUser,
  query: BulletinListQuery,
): Promise<BulletinListResponse> {
  const mayReadDrafts = can(viewer, "readDraftBulletins");
  if (query.status && !isPublishedState(query.status) && !mayReadDrafts)
    throw new AppError(
      "FORBIDDEN",
      "Only issued, superseded and withdrawn bulletins are listed for your role.",
    );
  const statuses = query.status ? [query.status] : mayReadDrafts ? undefined : PUBLISHED_STATES;
  const { rows, total } = await listBulletins({
    statuses,
    day: query.day,
    page: query.page,
    pageSize: query.pageSize,
  });
  return { bulletins: rows, total, page: query.page, pageSize: query.pageSize };
}
