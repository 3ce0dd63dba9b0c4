// Seeds the invented demo office on first start (an empty users table), in one transaction.
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { organisations, settings, users } from "@/db/schema";
import { DEFAULT_OFFICE_SETTINGS } from "@/lib/schemas/settings";
import { recordAudit } from "@/server/audit/audit.db";
import { seedDemoModels } from "@/server/forecast/models.db";
import { loadDemoArchive } from "./archive/load";
import { seedDemoContacts } from "@/server/dissemination/demo-contacts";
import { hashPassword } from "@/server/auth/passwords";
import { DEMO_CONTACT_LINE, DEMO_OFFICE_NAME, DEMO_ORGANISATIONS, DEMO_PEOPLE } from "./people";

export async function isDatabaseEmpty(): Promise<boolean> {
  const [row] = await getDb().select({ n: sql<number>`count(*)::int` }).from(users);
  return (row?.n ?? 0) === 0;
}

export async function seedDemoOffice(): Promise<{ seeded: boolean }> {
  // The model registry is seeded on its own so an older data directory gains the demo models.
  await seedDemoModels();
  const seeded = await seedDemoPeople();
  // Idempotent, and a no-op without the demo forecasters, so a failed first load retries and a
  // real office never gains invented history. Archive regions are numbered from HR-3001 so the
  // live demo's HR-04xx numbers start fresh.
  if (process.env.FACULA_DEMO_ARCHIVE !== "off") await loadDemoArchive(getDb(), { firstRegionNumber: 3001 });
  return { seeded };
}

async function seedDemoPeople(): Promise<boolean> {
  if (!(await isDatabaseEmpty())) return false;
  const hashes = await Promise.all(DEMO_PEOPLE.map((p) => hashPassword(p.password)));
  await getDb().transaction(async (tx) => {
    const orgIds = new Map<string, number>();
    for (const org of DEMO_ORGANISATIONS) {
      const [row] = await tx
        .insert(organisations)
        .values({ name: org.name, sector: org.sector, isDemo: true })
        .returning({ id: organisations.id });
      if (row) orgIds.set(org.key, row.id);
    }
    for (const [i, person] of DEMO_PEOPLE.entries()) {
      await tx.insert(users).values({
        email: person.email,
        name: person.name,
        role: person.role,
        passwordHash: hashes[i] ?? null,
        organisationId: person.organisation ? (orgIds.get(person.organisation) ?? null) : null,
        isDemo: true,
      });
    }
    const office = { ...DEFAULT_OFFICE_SETTINGS, officeName: DEMO_OFFICE_NAME, contactLine: DEMO_CONTACT_LINE, isPublicBulletinsAllowed: true };
    await tx.insert(settings).values({ key: "office", value: office }).onConflictDoNothing();
    const { contacts } = await seedDemoContacts(tx);
    await recordAudit({ actor: null, action: "demo.seeded", details: { people: DEMO_PEOPLE.length, contacts } }, tx);
  });
  return true;
}
