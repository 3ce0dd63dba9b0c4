// Owns the catalogue of e-mail templates: their names, data shapes, subjects and required values.

/** A table cell: callers format numbers (e.g. "35%") before rendering. */
export type EmailCell = string | number;

/** One full-disk row: probability of at least one flare of the level or above per window. */
export interface FullDiskRow {
  level: string;
  p24: EmailCell;
  p48: EmailCell;
  p72: EmailCell;
}

/** One active region with its 24 h probabilities. */
export interface RegionRow {
  regionNumber: string;
  location: string;
  mcintoshClass: string;
  mountWilsonClass: string;
  areaMsh: EmailCell;
  cPlus24: EmailCell;
  mPlus24: EmailCell;
  x24: EmailCell;
}

/** Times are preformatted "YYYY-MM-DD HH:MM"; the templates add the " UTC" suffix. */
export interface InvitationEmail {
  officeName: string;
  inviteeName?: string;
  roleLabel: string;
  inviterName: string;
  acceptUrl: string;
  expiresAtUtc: string;
}

export interface BulletinEmail {
  officeName: string;
  bulletinVersion: number;
  forecastDateUtc: string;
  issueTimeUtc: string;
  supersedesVersion?: number;
  rows: FullDiskRow[];
  regions: RegionRow[];
  discussionParagraphs: string[];
  caution: string;
  bulletinUrl?: string;
  unsubscribeUrl?: string;
}

export interface AlertEmail {
  officeName: string;
  recipientName?: string;
  alertReference: string;
  thresholdDescription: string;
  bulletinVersion: number;
  issueTimeUtc: string;
  rows: FullDiskRow[];
  caution: string;
  ackUrl: string;
  unsubscribeUrl?: string;
}

export interface AlertReminderEmail extends AlertEmail {
  raisedAtUtc: string;
}

export interface AlertEscalationEmail extends AlertReminderEmail {
  subscriberName: string;
}

export interface EmailTemplateData {
  invitation: InvitationEmail;
  bulletin: BulletinEmail;
  alert: AlertEmail;
  "alert-reminder": AlertReminderEmail;
  "alert-escalation": AlertEscalationEmail;
}

export type EmailTemplateName = keyof EmailTemplateData;

interface TemplateSpec {
  /** Mustache, rendered without HTML escaping and flattened to one line. */
  subject: string;
  /** Values that must be present and non-empty. */
  required: readonly string[];
  /** Values that must be arrays (they may be empty). */
  lists: readonly string[];
}

const alertRequired = [
  "officeName",
  "alertReference",
  "thresholdDescription",
  "bulletinVersion",
  "issueTimeUtc",
  "caution",
  "ackUrl",
] as const;

export const emailTemplates: Readonly<Record<EmailTemplateName, TemplateSpec>> = {
  invitation: {
    subject: "{{inviterName}} invited you to {{officeName}} on Facula",
    required: ["officeName", "roleLabel", "inviterName", "acceptUrl", "expiresAtUtc"],
    lists: [],
  },
  bulletin: {
    subject: "{{officeName}} flare-risk bulletin v{{bulletinVersion}}, issued {{issueTimeUtc}} UTC",
    required: ["officeName", "bulletinVersion", "forecastDateUtc", "issueTimeUtc", "caution"],
    lists: ["rows", "regions", "discussionParagraphs"],
  },
  alert: {
    subject: "Flare-risk alert: {{thresholdDescription}} ({{officeName}})",
    required: alertRequired,
    lists: ["rows"],
  },
  "alert-reminder": {
    subject: "Reminder, please acknowledge: {{thresholdDescription}} ({{officeName}})",
    required: [...alertRequired, "raisedAtUtc"],
    lists: ["rows"],
  },
  "alert-escalation": {
    subject: "Unacknowledged alert for {{subscriberName}}: {{thresholdDescription}}",
    required: [...alertRequired, "raisedAtUtc", "subscriberName"],
    lists: ["rows"],
  },
};

export function isEmailTemplateName(name: string): name is EmailTemplateName {
  return Object.hasOwn(emailTemplates, name);
}
