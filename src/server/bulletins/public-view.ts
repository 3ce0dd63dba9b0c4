// Published bulletins for the print pages: who may read them without signing in (the office
// setting), and one bulletin with the version that replaced it, if any.
import { isPublishedState, type BulletinState } from "@/lib/domain/bulletin-states";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { listSuccessors } from "./bulletin-lists.db";
import { findBulletin } from "./bulletins.db";
import { fromStoredContent } from "./content-json";
import type { IssuedBulletin } from "./issued-bulletin";

export interface PublishedBulletin {
  status: BulletinState;
  bulletin: IssuedBulletin;
  withdrawnReason: string | null;
  supersededBy: { id: number; version: number } | null;
}

/** "public": anyone may read; "signed-in": readers must sign in (the office keeps bulletins private). */
export async function publicAccess(): Promise<"public" | "signed-in"> {
  return (await getOfficeSettings()).isPublicBulletinsAllowed ? "public" : "signed-in";
}

/** null for unknown ids and for bulletins not issued yet: those do not exist publicly. */
export async function findPublishedBulletin(id: number): Promise<PublishedBulletin | null> {
  const row = await findBulletin(id);
  if (!row || !isPublishedState(row.status)) return null;
  const [successor] = row.status === "superseded" ? await listSuccessors([row.id]) : [];
  return {
    status: row.status,
    bulletin: fromStoredContent(row.content),
    withdrawnReason: row.withdrawnReason,
    supersededBy: successor ? { id: successor.id, version: successor.version } : null,
  };
}
