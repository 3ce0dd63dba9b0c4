// Owns importing a contact roster: a preview with every row's problems, then all rows or none
// in one transaction, linked to subscriber accounts by e-mail and audited.
import { getDb } from "@/db/client";
import { alertThresholds, contacts, organisations } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { previewContactCsv, type ImportPreview } from "./contact-csv";
import { listContactEmails, listSubscriberAccounts } from "./contacts.db";
import { toStoredThreshold } from "./thresholds.service";

export type ImportOutcome =
  | { committed: false; preview: ImportPreview }
  | { committed: true; created: number; thresholds: number; preview: ImportPreview };

async function buildPreview(csv: string): Promise<ImportPreview> {
  const orgs = await getDb()
    .select({ id: organisations.id, name: organisations.name })
    .from(organisations);
  return previewContactCsv(csv, {
    organisations: new Map(orgs.map((o) => [o.name.toLowerCase(), o.id])),
    existingEmails: await listContactEmails(),
  });
}

function isUniqueViolation(err: unknown): boolean {
  const code =
    (err as { code?: string; cause?: { code?: string } } | null)?.code ??
    (err as { cause?: { code?: string } } | null)?.cause?.code;
  return code === "23505";
}

export async function importContacts(
  csv: string,
  mode: "preview" | "commit",
  actor: CurrentUser,
): Promise<ImportOutcome> {
  const preview = await buildPreview(csv);
  const hasProblems = preview.fileErrors.length > 0 || preview.invalidCount > 0;
  if (mode === "preview" || hasProblems) return { committed: false, preview };
  try {
    return await getDb().transaction(async (tx) => {
      const accounts = await listSubscriberAccounts(tx);
      let thresholdCount = 0;
      for (let start = 0; start < preview.rows.length; start += 500) {
        const chunk = preview.rows.slice(start, start + 500);
        const inserted = await tx
          .insert(contacts)
          .values(
            chunk.map((r) => ({
              organisationId: r.organisationId as number,
              name: r.name,
              email: r.email,
              wantsBulletins: r.wantsBulletins,
              userId: accounts.get(r.email.toLowerCase()) ?? null,
            })),
          )
          .returning({ id: contacts.id });
        const thresholds = chunk.flatMap((r, i) =>
          r.thresholds.map((t) => ({
            contactId: inserted[i]?.id as number,
            ...toStoredThreshold(t),
          })),
        );
        if (thresholds.length) await tx.insert(alertThresholds).values(thresholds);
        thresholdCount += thresholds.length;
      }
      await recordAudit(
        {
          actor: { id: actor.id, email: actor.email },
          action: "contact.imported",
          targetType: "contact",
          details: {
            contacts: preview.rows.length,
            thresholds: thresholdCount,
            emails: preview.rows.map((r) => r.email),
          },
        },
        tx,
      );
      return {
        committed: true as const,
        created: preview.rows.length,
        thresholds: thresholdCount,
        preview,
      };
    });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError(
        "CONFLICT",
        "Someone added one of these addresses a moment ago: preview the file again.",
      );
    throw err;
  }
}
