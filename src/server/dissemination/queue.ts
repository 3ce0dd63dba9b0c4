// Owns queueing an issued bulletin, inside the issuing transaction: one outbox row per subscribed
// recipient, and alerts (with their e-mails) for every threshold the bulletin crosses.
import type { Tx } from "@/db/client";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";
import { publicBulletinUrl } from "@/server/bulletins/email-preview";
import { recordAudit } from "@/server/audit/audit.db";
import { readConfig, requireAuthSecret } from "@/server/config";
import { renderBulletinMail } from "./bulletin-mail";
import { MERGE_FIELDS } from "./mail-merge";
import { insertBulletinBody, insertBulletinDeliveries } from "./outbox.db";
import { raiseAlerts } from "./raise-alerts";

async function queueBulletinDeliveries(
  tx: Tx,
  bulletin: IssuedBulletin,
  baseUrl: string,
  now: Date,
): Promise<number> {
  // Rendered once with a placeholder for the recipient's unsubscribe link (see outbox.db.ts).
  const body = await renderBulletinMail(bulletin, {
    bulletinUrl: publicBulletinUrl(bulletin.id),
    unsubscribeUrl: `${baseUrl}/unsubscribe?token=${MERGE_FIELDS.unsubscribeToken}`,
  });
  await insertBulletinBody(tx, bulletin.id, body, now);
  return insertBulletinDeliveries(tx, bulletin.id, body.subject, now);
}

/**
 * Called by the issuing transaction. `deliveries` counts the bulletin e-mails queued, `alerts`
 * the alerts raised (each has one alert e-mail queued too). Queueing the same bulletin again adds
 * nothing: every outbox row and alert is unique by its key.
 */
export async function queueIssuedBulletin(
  tx: Tx,
  bulletin: IssuedBulletin,
  previous: IssuedBulletin | null,
  now: Date,
): Promise<{ deliveries: number; alerts: number }> {
  const secret = requireAuthSecret();
  const baseUrl = readConfig().publicBaseUrl;
  const deliveries = await queueBulletinDeliveries(tx, bulletin, baseUrl, now);
  const alerts = await raiseAlerts({ tx, bulletin, previous, now, secret, baseUrl });
  await recordAudit(
    {
      actor: null,
      action: "dissemination.queued",
      targetType: "bulletin",
      targetId: bulletin.id,
      details: { deliveries, alerts, previousBulletinId: previous?.id ?? null },
    },
    tx,
  );
  return { deliveries, alerts };
}
