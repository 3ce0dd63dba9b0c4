// Owns raising alerts inside the issuing transaction: one alert row per crossed threshold and one
// alert e-mail in the outbox, each with its own acknowledgement link.
import type { Db, Tx } from "@/db/client";
import { alerts } from "@/db/schema";
import { FLARE_LEVELS, type FlareLevel, type WindowKey } from "@/lib/domain/flare-levels";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";
import { createAlertMailComposer } from "./alert-mail";
import { decideCrossing } from "./crossing";
import { ackExpiry, signAckToken, signUnsubscribeToken, unsubscribeExpiry } from "./link-tokens";
import { insertOutboxRows, outboxKeys, type OutboxInsert } from "./outbox.db";
import {
  inForceKey,
  listAlertsInForce,
  listContactsById,
  listSubscribedThresholds,
} from "./recipients.db";

export interface RaiseContext {
  tx: Db | Tx;
  bulletin: IssuedBulletin;
  previous: IssuedBulletin | null;
  now: Date;
  secret: string;
  baseUrl: string;
}

type AlertInsert = typeof alerts.$inferInsert;

function cellOf(
  level: string,
  windowHours: number,
): { level: FlareLevel; window: WindowKey } | null {
  const window = `${windowHours}h`;
  if (
    !(FLARE_LEVELS as readonly string[]).includes(level) ||
    !["24h", "48h", "72h"].includes(window)
  )
    return null;
  return { level: level as FlareLevel, window: window as WindowKey };
}

async function decideAlerts(ctx: RaiseContext): Promise<AlertInsert[]> {
  const thresholds = await listSubscribedThresholds(ctx.tx);
  const inForce = await listAlertsInForce(ctx.tx, ctx.bulletin.issueTime);
  const seen = new Set<string>();
  const out: AlertInsert[] = [];
  for (const t of thresholds) {
    const cell = cellOf(t.level, t.windowHours);
    const key = inForceKey(t.contactId, t.level, t.windowHours);
    if (!cell || seen.has(key)) continue;
    const probability = ctx.bulletin.fullDisk[cell.level][cell.window];
    const decision = decideCrossing({
      probability,
      threshold: t.probability,
      previousProbability: ctx.previous ? ctx.previous.fullDisk[cell.level][cell.window] : null,
      hasAlertInForce: inForce.has(key),
    });
    if (!decision.alert) continue;
    seen.add(key);
    out.push({
      bulletinId: ctx.bulletin.id,
      contactId: t.contactId,
      thresholdId: t.id,
      level: t.level,
      windowHours: t.windowHours,
      thresholdProbability: t.probability,
      probability,
      raisedAt: ctx.now,
    });
  }
  return out;
}

/** Returns the number of alerts raised (each with one alert e-mail queued). */
export async function raiseAlerts(ctx: RaiseContext): Promise<number> {
  const wanted = await decideAlerts(ctx);
  const raised: (typeof alerts.$inferSelect)[] = [];
  for (let start = 0; start < wanted.length; start += 1000) {
    raised.push(
      ...(await ctx.tx
        .insert(alerts)
        .values(wanted.slice(start, start + 1000))
        .onConflictDoNothing()
        .returning()),
    );
  }
  const byId = new Map(
    (
      await listContactsById(
        ctx.tx,
        raised.map((a) => a.contactId),
      )
    ).map((r) => [r.id, r]),
  );
  const composer = createAlertMailComposer(ctx.bulletin, ctx.baseUrl);
  const rows: OutboxInsert[] = [];
  for (const alert of raised) {
    const contact = byId.get(alert.contactId);
    if (!contact) continue;
    const mail = await composer.compose("alert", alert, {
      name: contact.name,
      ackToken: signAckToken(
        ctx.secret,
        { alertId: alert.id, contactId: contact.id },
        ackExpiry(ctx.bulletin.issueTime, alert.windowHours),
      ),
      unsubscribeToken: signUnsubscribeToken(
        ctx.secret,
        { contactId: contact.id },
        unsubscribeExpiry(ctx.now),
      ),
    });
    rows.push({
      kind: "alert",
      bulletinId: ctx.bulletin.id,
      alertId: alert.id,
      contactId: contact.id,
      toEmail: contact.email,
      ...mail,
      idempotencyKey: outboxKeys.alert(alert.id),
      createdAt: ctx.now,
      nextAttemptAt: ctx.now,
    });
  }
  await insertOutboxRows(ctx.tx, rows);
  return raised.length;
}
