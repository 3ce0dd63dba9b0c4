// The versioned JSON feed of published bulletins (issued, superseded, withdrawn), newest first,
// paged by issue time. Its shape is documented in docs/api-bulletins.md; change it only with a
// new feedVersion.
import type { BulletinState } from "@/lib/domain/bulletin-states";
import type { BulletinRegionJson } from "@/lib/query/bulletins";
import type { FeedQuery } from "@/lib/schemas/bulletins";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { listPublished, listSuccessors } from "./bulletin-lists.db";
import { fromStoredContent, toStoredContent } from "./content-json";
import { publicBulletinUrl } from "./email-preview";
import { validityWindows } from "./validity";

export const FEED_VERSION = 1;

export interface FeedBulletin {
  id: number;
  forecastDay: string;
  version: number;
  status: BulletinState;
  issueTime: string;
  validity: { window: string; hours: number; start: string; end: string }[];
  fullDisk: ProbabilityGrid;
  regions: BulletinRegionJson[];
  discussion: string;
  cautions: string[];
  supersedes: { id: number; version: number } | null;
  supersededBy: { id: number; version: number } | null;
  withdrawnReason: string | null;
  isDemo: boolean;
  url: string;
}

export interface BulletinFeed {
  feedVersion: typeof FEED_VERSION;
  office: { name: string; contactLine: string };
  generatedAt: string;
  bulletins: FeedBulletin[];
  /** Pass as ?before= for the next (older) page; null on the last page. */
  nextBefore: string | null;
}

export async function buildFeed(query: FeedQuery, now = new Date()): Promise<BulletinFeed> {
  const [office, rows] = await Promise.all([
    getOfficeSettings(),
    listPublished(query.limit, query.before ? new Date(query.before) : undefined),
  ]);
  const successors = await listSuccessors(
    rows.filter((r) => r.status === "superseded").map((r) => r.id),
  );
  const bulletins = rows.map((row): FeedBulletin => {
    const content = fromStoredContent(row.content);
    const json = toStoredContent(content);
    const successor = successors.find((s) => s.supersedesId === row.id);
    return {
      id: row.id,
      forecastDay: row.forecastDay,
      version: row.version,
      status: row.status,
      issueTime: json.issueTime,
      validity: validityWindows(content.issueTime).map((w) => ({
        window: w.window,
        hours: w.hours,
        start: w.startsAt.toISOString(),
        end: w.endsAt.toISOString(),
      })),
      fullDisk: json.fullDisk,
      regions: json.regions,
      discussion: json.discussion,
      cautions: json.cautions,
      supersedes:
        row.supersedesId !== null && content.supersedesVersion !== null
          ? { id: row.supersedesId, version: content.supersedesVersion }
          : null,
      supersededBy: successor ? { id: successor.id, version: successor.version } : null,
      withdrawnReason: row.withdrawnReason,
      isDemo: row.isDemo,
      url: publicBulletinUrl(row.id),
    };
  });
  const last = rows.at(-1);
  return {
    feedVersion: FEED_VERSION,
    office: { name: office.officeName, contactLine: office.contactLine },
    generatedAt: now.toISOString(),
    bulletins,
    nextBefore:
      rows.length === query.limit && last?.issueTime ? last.issueTime.toISOString() : null,
  };
}
