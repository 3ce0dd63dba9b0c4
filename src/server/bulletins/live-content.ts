// Reads a bulletin's content: frozen from `content` once issued, or composed live from the day's
// assessments, full-disk table and office settings while it is open.
import { BULLETIN_CAUTIONS } from "@/lib/domain/cautions";
import { isOpenState } from "@/lib/domain/bulletin-states";
import { listDay } from "@/server/forecast/assessments.db";
import { getFullDisk } from "@/server/forecast/full-disk.service";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { composeBulletinContent } from "./bulletin-content";
import { fingerprintContent, fromStoredContent } from "./content-json";
import { findBulletin, type BulletinRow } from "./bulletins.db";
import type { IssuedBulletin } from "./issued-bulletin";

export interface BulletinContentState {
  bulletin: IssuedBulletin | null;
  problems: string[];
  /** Fingerprint of the live content (null once frozen or while incomplete). */
  contentHash: string | null;
  isLive: boolean;
}

/** The version a correction supersedes, if that bulletin is still the one in force. */
export async function supersededTarget(row: BulletinRow): Promise<BulletinRow | null> {
  if (row.supersedesId === null) return null;
  const target = await findBulletin(row.supersedesId);
  return target?.status === "issued" ? target : null;
}

export async function composeLiveContent(
  row: BulletinRow,
  now: Date,
): Promise<BulletinContentState> {
  const [assessed, fullDisk, office, target] = await Promise.all([
    listDay(row.forecastDay),
    getFullDisk(row.forecastDay),
    getOfficeSettings(),
    supersededTarget(row),
  ]);
  const { bulletin, problems } = composeBulletinContent({
    id: row.id,
    forecastDay: row.forecastDay,
    version: row.version,
    issueTime: now,
    officeName: office.officeName,
    contactLine: office.contactLine,
    cautions: BULLETIN_CAUTIONS,
    fullDisk: fullDisk.final,
    regions: assessed,
    discussion: row.discussion,
    supersedesVersion: target?.version ?? null,
    isDemo: row.isDemo,
  });
  return {
    bulletin,
    problems,
    contentHash: bulletin ? fingerprintContent(bulletin) : null,
    isLive: true,
  };
}

export async function readBulletinContent(
  row: BulletinRow,
  now: Date,
): Promise<BulletinContentState> {
  if (isOpenState(row.status)) return composeLiveContent(row, now);
  return {
    bulletin: fromStoredContent(row.content),
    problems: [],
    contentHash: null,
    isLive: false,
  };
}
