// A small invented desk for bulletin tests (demo — invented for the scenario): people of every
// role, a subscriber contact with one threshold, and a forecast day with two assessed regions.
import type { APIRoute } from "astro";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alertThresholds, auditEvents, contacts, organisations } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { createAssessmentSchema } from "@/lib/schemas/assessment";
import { createAssessment } from "@/server/forecast/assessments.service";
import { seedDemoModels } from "@/server/forecast/models.db";
import { callRoute, createActor } from "../forecast/api-call";

export interface Desk {
  forecaster: CurrentUser;
  dutyA: CurrentUser;
  dutyB: CurrentUser;
  verifier: CurrentUser;
  subscriber: CurrentUser;
}

export async function seedDesk(): Promise<Desk> {
  await seedDemoModels();
  const desk = {
    forecaster: await createActor("forecaster", "ines@halden.example"),
    dutyA: await createActor("duty_officer", "aurelia@halden.example"),
    dutyB: await createActor("duty_officer", "kofi@halden.example"),
    verifier: await createActor("verifier", "priya@halden.example"),
    subscriber: await createActor("subscriber", "dana@northmarch.example"),
  };
  const [org] = await getDb()
    .insert(organisations)
    .values({
      name: "Northmarch Transmission Cooperative (demo)",
      sector: "power-grid",
      isDemo: true,
    })
    .returning();
  const [contact] = await getDb()
    .insert(contacts)
    .values({
      organisationId: org!.id,
      userId: desk.subscriber.id,
      name: "Dana Whitlock",
      email: "dana@northmarch.example",
      isDemo: true,
    })
    .returning();
  // A low threshold, so the first issued bulletin crosses it.
  await getDb()
    .insert(alertThresholds)
    .values({ contactId: contact!.id, level: "C+", windowHours: 24, probability: 0.01 });
  return desk;
}

/** Two regions: HR-0412 with finals (a reason in every cell), HR-0413 on guidance only. */
export async function assessDay(day: string, actor: CurrentUser): Promise<void> {
  const finals = {
    "C+": { "24h": 0.6, "48h": 0.75, "72h": 0.82 },
    "M+": { "24h": 0.2, "48h": 0.3, "72h": 0.36 },
    X: { "24h": 0.03, "48h": 0.05, "72h": 0.07 },
  };
  const reasons = Object.fromEntries(
    ["C+", "M+", "X"].flatMap((l) =>
      ["24h", "48h", "72h"].map((w) => [
        `${l}.${w}`,
        "New flux emergence seen in the demo magnetograms.",
      ]),
    ),
  );
  await createAssessment(
    createAssessmentSchema.parse({
      forecastDay: day,
      region: "HR-0412",
      location: "N12E34",
      areaMsh: 480,
      spotCount: 22,
      mcintosh: "Dkc",
      mountWilson: "beta-gamma-delta",
      unsignedFluxMx: 3e22,
      pilLengthMm: 60,
      logR: 4.4,
      meanShearDeg: 48,
      flares24h: { C: 4, M: 1, X: 0 },
      finals,
      finalReasons: reasons,
    }),
    actor,
    { isDemo: true },
  );
  await createAssessment(
    createAssessmentSchema.parse({
      forecastDay: day,
      region: "HR-0413",
      location: "S05W20",
      areaMsh: 80,
      spotCount: 6,
      mcintosh: "Cso",
      mountWilson: "beta",
      flares24h: { C: 1, M: 0, X: 0 },
    }),
    actor,
    { isDemo: true },
  );
}

export const call = (
  route: APIRoute,
  path: string,
  method: string,
  user: CurrentUser | null,
  body?: unknown,
  params: Record<string, string> = {},
) =>
  callRoute(
    route,
    path,
    body === undefined ? { method, user, params } : { method, user, body, params },
  );

export async function auditActionsFor(bulletinId: number): Promise<string[]> {
  const rows = await getDb()
    .select({ action: auditEvents.action })
    .from(auditEvents)
    .where(
      sql`${auditEvents.targetType} = 'bulletin' and ${auditEvents.targetId} = ${String(bulletinId)}`,
    )
    .orderBy(auditEvents.id);
  return rows.map((r) => r.action);
}

export async function countWhere(
  table: "forecast_records" | "outbox" | "alerts" | "bulletin_comments",
  bulletinId: number,
): Promise<number> {
  const result = await getDb().execute<{ n: number }>(
    sql`select count(*)::int as n from ${sql.identifier(table)} where bulletin_id = ${bulletinId}`,
  );
  return result.rows[0]?.n ?? -1;
}
