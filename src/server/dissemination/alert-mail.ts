// Owns the alert, reminder and escalation e-mails: rendered once per variant (kind, threshold,
// probability) with placeholder words, then merged per recipient.
import { ALERT_CAUTION } from "@/lib/domain/cautions";
import type { FlareLevel, ProbabilityGrid } from "@/lib/domain/flare-levels";
import { renderEmail, type RenderedEmail } from "@/server/email/render";
import type { AlertEmail } from "@/server/email/templates";
import { toFullDiskRows } from "./bulletin-mail";
import { compileMerge, MERGE_FIELDS, type MergeTemplate } from "./mail-merge";
import { formatMailPercent, formatMailTime } from "./mail-values";

export type AlertMailKind = "alert" | "alert-reminder" | "alert-escalation";

export interface AlertBulletinFacts {
  id: number;
  officeName: string;
  version: number;
  issueTime: Date;
  fullDisk: ProbabilityGrid;
}

export interface AlertFacts {
  id: number;
  level: FlareLevel | string;
  windowHours: number;
  thresholdProbability: number;
  probability: number;
  raisedAt: Date;
}

export interface AlertRecipient {
  name: string;
  /** Signed acknowledgement token (contact mails); escalations link to the alert board instead. */
  ackToken?: string;
  unsubscribeToken?: string;
  /** The contact an escalation is about. */
  subscriberName?: string;
}

export function alertReference(alertId: number): string {
  return `AL-${alertId}`;
}

export function describeAlertCrossing(
  alert: Pick<AlertFacts, "level" | "windowHours" | "probability" | "thresholdProbability">,
): string {
  return `${alert.level} within ${alert.windowHours} h at ${formatMailPercent(alert.probability)} (threshold ${formatMailPercent(alert.thresholdProbability)})`;
}

export interface AlertMailComposer {
  compose(
    kind: AlertMailKind,
    alert: AlertFacts,
    recipient: AlertRecipient,
  ): Promise<RenderedEmail>;
}

/** One composer per bulletin and pass; it keeps each rendered variant for the next recipient. */
export function createAlertMailComposer(
  bulletin: AlertBulletinFacts,
  baseUrl: string,
): AlertMailComposer {
  const rendered = new Map<string, Promise<MergeTemplate>>();
  const rows = toFullDiskRows(bulletin);

  function renderVariant(
    kind: AlertMailKind,
    alert: AlertFacts,
    hasUnsubscribe: boolean,
  ): Promise<MergeTemplate> {
    const key = [
      kind,
      alert.level,
      alert.windowHours,
      alert.thresholdProbability,
      alert.probability,
      alert.raisedAt.getTime(),
      hasUnsubscribe,
    ].join("|");
    let found = rendered.get(key);
    if (!found) {
      const base: AlertEmail = {
        officeName: bulletin.officeName,
        recipientName: MERGE_FIELDS.name,
        alertReference: MERGE_FIELDS.reference,
        thresholdDescription: describeAlertCrossing(alert),
        bulletinVersion: bulletin.version,
        issueTimeUtc: formatMailTime(bulletin.issueTime),
        rows,
        caution: ALERT_CAUTION,
        ackUrl:
          kind === "alert-escalation"
            ? `${baseUrl}/alerts?bulletin=${bulletin.id}`
            : `${baseUrl}/ack?token=${MERGE_FIELDS.ackToken}`,
      };
      if (hasUnsubscribe)
        base.unsubscribeUrl = `${baseUrl}/unsubscribe?token=${MERGE_FIELDS.unsubscribeToken}`;
      const raisedAtUtc = formatMailTime(alert.raisedAt);
      const rendering =
        kind === "alert"
          ? renderEmail("alert", base)
          : kind === "alert-reminder"
            ? renderEmail("alert-reminder", { ...base, raisedAtUtc })
            : renderEmail("alert-escalation", {
                ...base,
                raisedAtUtc,
                subscriberName: MERGE_FIELDS.subscriber,
              });
      found = rendering.then(compileMerge);
      rendered.set(key, found);
      found.catch(() => rendered.delete(key));
    }
    return found;
  }

  return {
    async compose(kind, alert, recipient) {
      if (kind !== "alert-escalation" && !recipient.ackToken)
        throw new Error("An alert e-mail to a contact needs its acknowledgement link");
      const template = await renderVariant(kind, alert, recipient.unsubscribeToken !== undefined);
      return template.fill({
        name: recipient.name,
        reference: alertReference(alert.id),
        ackToken: recipient.ackToken,
        unsubscribeToken: recipient.unsubscribeToken,
        subscriber: recipient.subscriberName,
      });
    },
  };
}
