// Everything the bulletin page shows: the detail, what changed since the previous bulletin,
// guidance beside the finals per region (while open), and the e-mail preview.
import type { CurrentUser } from "@/lib/auth/roles";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { isOpenState } from "@/lib/domain/bulletin-states";
import type { BulletinDetail } from "@/lib/query/bulletins";
import { listDay } from "@/server/forecast/assessments.db";
import { diffBulletins, type BulletinChanges } from "./bulletin-diff";
import { findPreviousPublished } from "./bulletins.db";
import { describeBulletin, requireReadableBulletin } from "./bulletin-view";
import { fromStoredContent } from "./content-json";
import { listGuidanceForDay, type StoredGuidance } from "./day-guidance.db";
import { previewBulletinMail, type MailPreview } from "./email-preview";
import { readBulletinContent } from "./live-content";

export interface RegionGuidance {
  region: string;
  location: string;
  finals: ProbabilityGrid | null;
  blended: ProbabilityGrid | null;
  reasons: Record<string, string>;
  notes: string;
  models: StoredGuidance[];
}

export interface ReviewView {
  detail: BulletinDetail;
  issueTime: Date | null;
  changes: BulletinChanges | null;
  guidance: RegionGuidance[];
  mail: MailPreview | null;
  mailError: string | null;
}

export async function loadRegionGuidance(day: string): Promise<RegionGuidance[]> {
  const [assessed, stored] = await Promise.all([listDay(day), listGuidanceForDay(day)]);
  return assessed.map((a) => ({
    region: a.region,
    location: a.location,
    finals: a.finals,
    blended: a.blended,
    reasons: Object.fromEntries(Object.entries(a.finalReasons).filter(([, r]) => r.trim())),
    notes: a.notes,
    models: stored.filter((g) => g.region === a.region),
  }));
}

export async function loadReviewView(
  id: number,
  viewer: CurrentUser,
  now = new Date(),
): Promise<ReviewView> {
  const row = await requireReadableBulletin(id, viewer);
  const content = await readBulletinContent(row, now);
  const previousRow = await findPreviousPublished(row);
  const previous = previousRow?.content ? fromStoredContent(previousRow.content) : null;
  const [detail, guidance, preview] = await Promise.all([
    describeBulletin(row, viewer, content),
    isOpenState(row.status) ? loadRegionGuidance(row.forecastDay) : Promise.resolve([]),
    content.bulletin
      ? previewBulletinMail(content.bulletin)
      : Promise.resolve({ mail: null, error: null }),
  ]);
  return {
    detail,
    issueTime: content.bulletin?.issueTime ?? null,
    changes: content.bulletin ? diffBulletins(previous, content.bulletin) : null,
    guidance,
    mail: preview.mail,
    mailError: preview.error,
  };
}
