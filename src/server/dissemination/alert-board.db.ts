// Owns the alert board: every alert with its acknowledgement state and the delivery state of its
// e-mail, filterable by bulletin and state, and the list of contacts still to chase.
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alerts, bulletins, contacts, outbox } from "@/db/schema";
import type { AlertState } from "@/lib/schemas/subscriptions";
import { selectAlertViews, toAlertView, type AlertView } from "./alerts.db";
import { alertStateAt, isChaseable } from "./alert-state";

export interface BoardAlert extends AlertView {
  state: AlertState;
  contactEmail: string;
  mailStatus: string | null;
}

export interface BoardFilter {
  bulletin?: number;
  state?: AlertState;
}

const BOARD_LIMIT = 500;

export async function getAlertBoard(filter: BoardFilter, now: Date = new Date()) {
  const db = getDb();
  const rows = await selectAlertViews(db)
    .where(filter.bulletin ? eq(alerts.bulletinId, filter.bulletin) : undefined)
    .orderBy(desc(alerts.raisedAt), desc(alerts.id))
    .limit(BOARD_LIMIT);
  const ids = rows.map((r) => r.alert.id);
  const mails = ids.length
    ? await db
        .select({ alertId: outbox.alertId, status: outbox.status })
        .from(outbox)
        .where(and(eq(outbox.kind, "alert"), inArray(outbox.alertId, ids)))
    : [];
  const mailStatus = new Map(mails.map((m) => [m.alertId, m.status]));
  const emails = ids.length
    ? new Map(
        (
          await db
            .select({ id: contacts.id, email: contacts.email })
            .from(contacts)
            .where(inArray(contacts.id, [...new Set(rows.map((r) => r.alert.contactId))]))
        ).map((c) => [c.id, c.email]),
      )
    : new Map<number, string>();
  const all: BoardAlert[] = rows.map((r) => {
    const view = toAlertView(r);
    return {
      ...view,
      state: alertStateAt(view, now),
      contactEmail: emails.get(view.contactId) ?? "",
      mailStatus: mailStatus.get(view.id) ?? null,
    };
  });
  const counts: Record<AlertState, number> = {
    open: 0,
    reminded: 0,
    escalated: 0,
    acknowledged: 0,
    expired: 0,
  };
  for (const a of all) counts[a.state] += 1;
  return {
    alerts: filter.state ? all.filter((a) => a.state === filter.state) : all,
    chase: all
      .filter((a) => isChaseable(a.state))
      .sort((a, b) => a.raisedAt.getTime() - b.raisedAt.getTime()),
    counts,
    bulletins: await listBulletinsWithAlerts(),
    isTruncated: rows.length === BOARD_LIMIT,
  };
}

async function listBulletinsWithAlerts() {
  return getDb()
    .select({
      id: bulletins.id,
      forecastDay: bulletins.forecastDay,
      version: bulletins.version,
      issueTime: bulletins.issueTime,
      alertCount: sql<number>`count(${alerts.id})::int`,
    })
    .from(bulletins)
    .innerJoin(alerts, eq(alerts.bulletinId, bulletins.id))
    .groupBy(bulletins.id)
    .orderBy(desc(bulletins.issueTime), desc(bulletins.id))
    .limit(30);
}
