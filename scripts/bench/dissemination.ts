// Benchmark of dissemination: one bulletin to 10,000 contacts, queued in the issuing transaction
// and delivered through the local Resend fake by worker passes, all in this process.
import { eq, sql } from "drizzle-orm";
import { pathToFileURL } from "node:url";
import { closeDatabase, getDb, openDatabase } from "../../src/db/client";
import { bulletins, contacts, organisations, outbox, users } from "../../src/db/schema";
import { BULLETIN_CAUTIONS } from "../../src/lib/domain/cautions";
import { buildGrid } from "../../src/lib/domain/flare-levels";
import { toStoredContent } from "../../src/server/bulletins/content-json";
import type { IssuedBulletin } from "../../src/server/bulletins/issued-bulletin";
import { runDeliveryPass } from "../../src/server/dissemination/delivery-pass";
import { queueIssuedBulletin } from "../../src/server/dissemination/queue";
import { createMailer } from "../../src/server/email/send";
import { startResendFake } from "../resend-fake.mjs";
import type { BenchFigure } from "./scoring";

const CONTACTS = 10_000;
const LIMIT_MS = 30_000;

// An invented bulletin of realistic size: eight regions and a two-paragraph discussion (demo).
function makeBulletin(id: number): IssuedBulletin {
  const grid = buildGrid(
    (level, window) =>
      ({ "C+": 0.7, "M+": 0.3, X: 0.05 })[level] * { "24h": 1, "48h": 1.2, "72h": 1.3 }[window],
  );
  return {
    id,
    forecastDay: "2026-05-04",
    version: 1,
    issueTime: new Date(),
    officeName: "Halden Ridge Space Weather Desk (demo)",
    contactLine: "Duty desk (demo)",
    fullDisk: grid,
    regions: Array.from({ length: 8 }, (_, i) => ({
      region: `HR-04${10 + i}`,
      location: `N1${i}E3${i}`,
      isLimbFlagged: false,
      areaMsh: 120 + 40 * i,
      mcintosh: "Dkc",
      mountWilson: "beta-gamma",
      probabilities: grid,
    })),
    discussion: `${"Region HR-0412 kept its delta configuration and grew in area. ".repeat(6)}\n\n${"Elsewhere the disk was quiet. ".repeat(6)}`,
    cautions: [...BULLETIN_CAUTIONS],
    supersedesVersion: null,
    isDemo: true,
  };
}

async function seedContacts(): Promise<{ authorId: number }> {
  const db = getDb();
  const [org] = await db
    .insert(organisations)
    .values({ name: "Bench Grid Cooperative (demo)", sector: "power-grid", isDemo: true })
    .returning({ id: organisations.id });
  const [author] = await db
    .insert(users)
    .values({
      email: "bench.author@halden-ridge.example",
      name: "Bench Author",
      role: "forecaster",
      isDemo: true,
    })
    .returning({ id: users.id });
  for (let start = 0; start < CONTACTS; start += 2000) {
    const rows = Array.from({ length: Math.min(2000, CONTACTS - start) }, (_, i) => ({
      organisationId: org!.id,
      name: `Bench contact ${start + i}`,
      email: `bench-${start + i}@operator.example`,
      isDemo: true,
    }));
    await db.insert(contacts).values(rows);
  }
  return { authorId: author!.id };
}

async function countLeft(): Promise<number> {
  const [row] = await getDb()
    .select({ n: sql<number>`count(*)::int` })
    .from(outbox)
    .where(sql`${outbox.status} in ('queued', 'sending') and ${outbox.kind} <> 'bulletin-body'`);
  return row?.n ?? -1;
}

export async function benchDissemination(): Promise<BenchFigure[]> {
  process.env.AUTH_SECRET ||= "bench-secret-only-for-the-in-process-benchmark-0123";
  process.env.PUBLIC_BASE_URL ||= "https://desk.halden-ridge.example";
  const fake = await startResendFake({ host: "127.0.0.1", port: 0 });
  await openDatabase({ location: "memory" });
  try {
    const { authorId } = await seedContacts();
    const mailer = createMailer({
      apiKey: "re_bench_key",
      baseUrl: fake.url,
      from: "Facula desk <desk@halden-ridge.example>",
    });
    const start = performance.now();
    const queued = await getDb().transaction(async (tx) => {
      const [row] = await tx
        .insert(bulletins)
        .values({
          forecastDay: "2026-05-04",
          version: 1,
          status: "in_review",
          authorId,
          isDemo: true,
        })
        .returning({ id: bulletins.id });
      const bulletin = makeBulletin(row!.id);
      await tx
        .update(bulletins)
        .set({
          status: "issued",
          issueTime: bulletin.issueTime,
          content: toStoredContent(bulletin) as unknown as Record<string, unknown>,
        })
        .where(eq(bulletins.id, row!.id));
      return queueIssuedBulletin(tx, bulletin, null, bulletin.issueTime);
    });
    const queueMs = performance.now() - start;
    console.log(`  queued ${queued.deliveries} deliveries in ${Math.round(queueMs)} ms`);
    let passes = 0;
    for (let left = await countLeft(); left > 0; left = await countLeft()) {
      const pass = await runDeliveryPass(new Date(), { mailer, maxMessages: 2500, concurrency: 4 });
      passes += 1;
      console.log(
        `  pass ${passes}: sent ${pass.sent}, retrying ${pass.retrying}, failed ${pass.failed}; ${left - pass.sent} left (${Math.round(performance.now() - start)} ms)`,
      );
      if (pass.claimed === 0 && passes > 50) throw new Error(`${left} deliveries never became due`);
    }
    const totalMs = performance.now() - start;
    const recipients = new Set(fake.messages().flatMap((m: { to: string[] }) => m.to));
    if (fake.messages().length !== CONTACTS || recipients.size !== CONTACTS) {
      throw new Error(
        `the fake holds ${fake.messages().length} messages for ${recipients.size} recipients, expected ${CONTACTS} each`,
      );
    }
    return [
      {
        name: `dissemination: bulletin to ${CONTACTS.toLocaleString("en")} contacts, queue + deliver`,
        value: Math.round(totalMs),
        unit: "ms",
        limit: LIMIT_MS,
      },
      {
        name: "dissemination: queueing in the issuing transaction",
        value: Math.round(queueMs),
        unit: "ms",
      },
      {
        name: "dissemination: delivery rate",
        value: Math.round((CONTACTS / (totalMs - queueMs)) * 1000),
        unit: "messages/s",
      },
    ];
  } finally {
    await closeDatabase();
    await fake.close();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const f of await benchDissemination())
    console.log(`${f.name}: ${f.value} ${f.unit}${f.limit ? ` (limit ${f.limit} ${f.unit})` : ""}`);
}
