// Starting a bulletin: version 1 of a forecast day, or — when the day's latest version is
// issued — the correction that will supersede it. One open bulletin per day (a unique index).
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import type { CreateBulletinData } from "@/lib/schemas/bulletins";
import { recordAudit } from "@/server/audit/audit.db";
import { listDay } from "@/server/forecast/assessments.db";
import { AppError } from "@/server/http/errors";
import {
  findLatestVersionForDay,
  findOpenBulletinForDay,
  insertBulletin,
  type BulletinRow,
} from "./bulletins.db";
import { actorOf } from "./lifecycle";

function openExists(day: string, id: number): AppError {
  return new AppError(
    "CONFLICT",
    `Bulletin #${id} for ${day} is still open: continue with that one.`,
    { fields: { forecastDay: "This day already has an open bulletin.", existingId: String(id) } },
  );
}

function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
}

/** Version 1 of a day, or — when the day's latest is issued — version n+1 that corrects it. */
export async function createBulletin(
  data: CreateBulletinData,
  actor: CurrentUser,
): Promise<BulletinRow> {
  const isDemo = (await listDay(data.forecastDay)).some((a) => a.isDemo);
  try {
    return await getDb().transaction(async (tx) => {
      const open = await findOpenBulletinForDay(data.forecastDay, tx);
      if (open) throw openExists(data.forecastDay, open.id);
      const latest = await findLatestVersionForDay(data.forecastDay, tx);
      const corrects = latest?.status === "issued" ? latest : null;
      const row = await insertBulletin(tx, {
        forecastDay: data.forecastDay,
        version: (latest?.version ?? 0) + 1,
        authorId: actor.id,
        // A correction starts from the text it corrects.
        discussion: corrects?.discussion ?? "",
        supersedesId: corrects?.id ?? null,
        isDemo,
      });
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "bulletin.created",
          targetType: "bulletin",
          targetId: row.id,
          details: { day: row.forecastDay, version: row.version, supersedesId: row.supersedesId },
        },
        tx,
      );
      return row;
    });
  } catch (err) {
    if (!isUniqueViolation(err)) throw err;
    const open = await findOpenBulletinForDay(data.forecastDay);
    throw open
      ? openExists(data.forecastDay, open.id)
      : new AppError(
          "CONFLICT",
          "Another bulletin for this day was started at the same moment: reload.",
        );
  }
}
