// Builds the dissemination world of a test: organisations, contacts with thresholds, issued
// bulletins queued as the issuing transaction does, and passes of the worker until done.
// Every name and number here is invented (demo — invented for the scenario).
import { eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alertThresholds, bulletins, contacts, organisations, outbox, users } from "@/db/schema";
import { BULLETIN_CAUTIONS } from "@/lib/domain/cautions";
import {
  buildGrid,
  type FlareLevel,
  type ProbabilityGrid,
  type WindowKey,
} from "@/lib/domain/flare-levels";
import type { Role } from "@/lib/auth/roles";
import { toStoredContent } from "@/server/bulletins/content-json";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";
import { runDeliveryPass, type DeliveryPassOptions } from "@/server/dissemination/delivery-pass";
import { queueIssuedBulletin } from "@/server/dissemination/queue";
import type { FakeMail } from "../../support/test-db";

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

export async function insertOrganisation(name = `Test grid ${unique()} (demo)`): Promise<number> {
  const [row] = await getDb()
    .insert(organisations)
    .values({ name, sector: "power-grid", isDemo: true })
    .returning({ id: organisations.id });
  return row!.id;
}

export async function insertUser(
  role: Role,
  email = `${role}-${unique()}@halden-ridge.example`,
  organisationId: number | null = null,
) {
  const [row] = await getDb()
    .insert(users)
    .values({ email, name: `Test ${role} ${counter}`, role, organisationId })
    .returning();
  return {
    id: row!.id,
    email: row!.email,
    name: row!.name,
    role: row!.role,
    organisationId: row!.organisationId,
  };
}

export interface ContactSpec {
  organisationId: number;
  email?: string;
  name?: string;
  wantsBulletins?: boolean;
  userId?: number | null;
  /** [level, window hours, probability] */
  thresholds?: [FlareLevel, 24 | 48 | 72, number][];
}

export async function insertContact(
  spec: ContactSpec,
): Promise<{ id: number; email: string; thresholdIds: number[] }> {
  const email = spec.email ?? `contact-${unique()}@operator.example`;
  const [row] = await getDb()
    .insert(contacts)
    .values({
      organisationId: spec.organisationId,
      email,
      name: spec.name ?? `Contact ${counter}`,
      wantsBulletins: spec.wantsBulletins ?? true,
      userId: spec.userId ?? null,
    })
    .returning({ id: contacts.id });
  const thresholdIds: number[] = [];
  for (const [level, windowHours, probability] of spec.thresholds ?? []) {
    const [t] = await getDb()
      .insert(alertThresholds)
      .values({ contactId: row!.id, level, windowHours, probability })
      .returning({ id: alertThresholds.id });
    thresholdIds.push(t!.id);
  }
  return { id: row!.id, email, thresholdIds };
}

/** A grid with the given cells set and everything else at 1 % (order rules are not checked here). */
export function gridWith(
  cells: Partial<Record<`${FlareLevel}.${WindowKey}`, number>>,
): ProbabilityGrid {
  return buildGrid((level, window) => cells[`${level}.${window}`] ?? 0.01);
}

let dayOffset = 0;

/** Inserts an issued bulletin and queues it in one transaction, as issuing does. */
export async function issueBulletin(
  fullDisk: ProbabilityGrid,
  previous: IssuedBulletin | null,
  now: Date,
  options: { queue?: boolean } = {},
) {
  const author = await insertUser("forecaster");
  const day = new Date(Date.UTC(2026, 0, 1) + dayOffset++ * 86_400_000).toISOString().slice(0, 10);
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .insert(bulletins)
      .values({
        forecastDay: day,
        version: 1,
        status: "in_review",
        authorId: author.id,
        isDemo: true,
      })
      .returning({ id: bulletins.id });
    const bulletin: IssuedBulletin = {
      id: row!.id,
      forecastDay: day,
      version: 1,
      issueTime: now,
      officeName: "Halden Ridge Space Weather Desk (demo)",
      contactLine: "Duty desk (demo)",
      fullDisk,
      regions: [],
      discussion: "Invented discussion for a test bulletin.",
      cautions: [...BULLETIN_CAUTIONS],
      supersedesVersion: null,
      isDemo: true,
    };
    // Frozen the way the issuing service freezes it: content, issue time and status in one update.
    await tx
      .update(bulletins)
      .set({
        status: "issued",
        issueTime: now,
        content: toStoredContent(bulletin) as unknown as Record<string, unknown>,
      })
      .where(eq(bulletins.id, row!.id));
    const queued =
      options.queue === false
        ? { deliveries: 0, alerts: 0 }
        : await queueIssuedBulletin(tx, bulletin, previous, now);
    return { bulletin, queued };
  });
}

export async function countOutbox(bulletinId: number): Promise<Record<string, number>> {
  const rows = await getDb()
    .select({ status: outbox.status, n: sql<number>`count(*)::int` })
    .from(outbox)
    .where(sql`${outbox.bulletinId} = ${bulletinId} and ${outbox.kind} <> 'bulletin-body'`)
    .groupBy(outbox.status);
  return Object.fromEntries(rows.map((r) => [r.status, r.n]));
}

export async function readOutbox(ids: number[]) {
  return ids.length ? getDb().select().from(outbox).where(inArray(outbox.id, ids)) : [];
}

export async function readOutboxFor(contactId: number) {
  return getDb().select().from(outbox).where(eq(outbox.contactId, contactId)).orderBy(outbox.id);
}

/** Runs passes, moving the clock by `stepMs` each time, until nothing is queued or sending. */
export async function drainDeliveries(
  start: Date,
  stepMs: number,
  options: DeliveryPassOptions = {},
  maxPasses = 200,
): Promise<{ passes: number; end: Date }> {
  let now = start;
  for (let passes = 1; passes <= maxPasses; passes++) {
    await runDeliveryPass(now, options);
    const [left] = await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(outbox)
      .where(sql`${outbox.status} in ('queued', 'sending') and ${outbox.kind} <> 'bulletin-body'`);
    if ((left?.n ?? 0) === 0) return { passes, end: now };
    now = new Date(now.getTime() + stepMs);
  }
  throw new Error(`deliveries still pending after ${maxPasses} passes`);
}

/** How many messages the fake holds for each address. */
export function countMessagesPerRecipient(fake: FakeMail): Map<string, number> {
  const counts = new Map<string, number>();
  for (const m of fake.messages())
    for (const to of [m.to].flat()) counts.set(to, (counts.get(to) ?? 0) + 1);
  return counts;
}

/** The token of a link (`/ack?token=` or `/unsubscribe?token=`) in a message's text part. */
export function linkToken(text: string, path: "/ack" | "/unsubscribe"): string {
  const match = new RegExp(`${path}\\?token=([A-Za-z0-9_.-]+)`).exec(text);
  if (!match?.[1]) throw new Error(`no ${path} link in:\n${text}`);
  return match[1];
}
