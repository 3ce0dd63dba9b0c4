// Owns turning an issued bulletin into the bulletin e-mail (the review preview and every delivery).
import { FLARE_LEVELS } from "@/lib/domain/flare-levels";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";
import { renderEmail, type RenderedEmail } from "@/server/email/render";
import type { BulletinEmail, FullDiskRow, RegionRow } from "@/server/email/templates";
import { formatMailPercent, formatMailTime, splitParagraphs } from "./mail-values";

export interface BulletinMailOptions {
  unsubscribeUrl?: string;
  bulletinUrl?: string;
}

export function toFullDiskRows(bulletin: Pick<IssuedBulletin, "fullDisk">): FullDiskRow[] {
  return FLARE_LEVELS.map((level) => {
    const row = bulletin.fullDisk[level];
    return {
      level,
      p24: formatMailPercent(row["24h"]),
      p48: formatMailPercent(row["48h"]),
      p72: formatMailPercent(row["72h"]),
    };
  });
}

function toRegionRows(bulletin: IssuedBulletin): RegionRow[] {
  return bulletin.regions.map((r) => ({
    // Metrics of limb regions are projection-affected; the e-mail says so beside the location.
    regionNumber: r.region,
    location: r.isLimbFlagged ? `${r.location} (limb)` : r.location,
    mcintoshClass: r.mcintosh ?? "—",
    mountWilsonClass: r.mountWilson ?? "—",
    areaMsh: r.areaMsh ?? "—",
    cPlus24: formatMailPercent(r.probabilities["C+"]["24h"]),
    mPlus24: formatMailPercent(r.probabilities["M+"]["24h"]),
    x24: formatMailPercent(r.probabilities.X["24h"]),
  }));
}

export function toBulletinEmail(
  bulletin: IssuedBulletin,
  options: BulletinMailOptions = {},
): BulletinEmail {
  const data: BulletinEmail = {
    officeName: bulletin.officeName,
    bulletinVersion: bulletin.version,
    forecastDateUtc: bulletin.forecastDay,
    issueTimeUtc: formatMailTime(bulletin.issueTime),
    rows: toFullDiskRows(bulletin),
    regions: toRegionRows(bulletin),
    discussionParagraphs: splitParagraphs(bulletin.discussion),
    caution: bulletin.cautions.join(" "),
  };
  if (bulletin.supersedesVersion !== null) data.supersedesVersion = bulletin.supersedesVersion;
  if (options.bulletinUrl) data.bulletinUrl = options.bulletinUrl;
  if (options.unsubscribeUrl) data.unsubscribeUrl = options.unsubscribeUrl;
  return data;
}

/** Renders the bulletin e-mail; about 30 ms (MJML), so deliveries render it once per bulletin. */
export async function renderBulletinMail(
  bulletin: IssuedBulletin,
  options: BulletinMailOptions = {},
): Promise<RenderedEmail> {
  return renderEmail("bulletin", toBulletinEmail(bulletin, options));
}
