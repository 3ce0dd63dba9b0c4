// Reads and writes the office settings row, always returning a complete, valid value.
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { settings } from "@/db/schema";
import { DEFAULT_OFFICE_SETTINGS, officeSettingsSchema, type OfficeSettings } from "@/lib/schemas/settings";
import { recordAudit } from "@/server/audit/audit.db";
import type { CurrentUser } from "@/lib/auth/roles";

const KEY = "office";

export async function getOfficeSettings(): Promise<OfficeSettings> {
  const [row] = await getDb().select().from(settings).where(eq(settings.key, KEY));
  const parsed = officeSettingsSchema.safeParse({ ...DEFAULT_OFFICE_SETTINGS, ...((row?.value as object) ?? {}) });
  return parsed.success ? parsed.data : DEFAULT_OFFICE_SETTINGS;
}

export async function saveOfficeSettings(value: OfficeSettings, actor: CurrentUser | null): Promise<void> {
  await getDb().transaction(async (tx) => {
    await tx
      .insert(settings)
      .values({ key: KEY, value })
      .onConflictDoUpdate({ target: settings.key, set: { value, updatedAt: new Date() } });
    await recordAudit({ actor: actor && { id: actor.id, email: actor.email }, action: "settings.changed", targetType: "settings", targetId: KEY, details: value }, tx);
  });
}
