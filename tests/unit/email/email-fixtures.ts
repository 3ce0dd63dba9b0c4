// Invented values for rendering tests (demo — invented for the scenario).
import type {
  AlertEscalationEmail,
  BulletinEmail,
  FullDiskRow,
  InvitationEmail,
} from "@/server/email/templates";

export const CAUTION =
  "Flare probabilities are guidance, not a storm warning. Operators act under their own procedures " +
  "and applicable reliability standards. This guidance does not replace national warnings.";

export const rows: FullDiskRow[] = [
  { level: "C+", p24: "45%", p48: "62%", p72: "71%" },
  { level: "M+", p24: "12%", p48: "20%", p72: "27%" },
  { level: "X", p24: "2%", p48: "3%", p72: "5%" },
];

export function makeInvitation(overrides: Partial<InvitationEmail> = {}): InvitationEmail {
  return {
    officeName: "Halden Ridge Space Weather Desk",
    inviteeName: "Ola Nordvik",
    roleLabel: "Forecaster",
    inviterName: "Ilse Marr",
    acceptUrl: "https://facula.example/invitations/accept?token=t0k3n/abc=1&x=2",
    expiresAtUtc: "2031-05-06 14:30",
    ...overrides,
  };
}

export function makeBulletin(overrides: Partial<BulletinEmail> = {}): BulletinEmail {
  return {
    officeName: "Halden Ridge Space Weather Desk",
    bulletinVersion: 3,
    forecastDateUtc: "2031-05-06",
    issueTimeUtc: "2031-05-06 00:30",
    rows,
    regions: [
      {
        regionNumber: "HR-0412",
        location: "N12E34",
        mcintoshClass: "Dkc",
        mountWilsonClass: "beta-gamma-delta",
        areaMsh: 480,
        cPlus24: "60%",
        mPlus24: "21%",
        x24: "3%",
      },
    ],
    discussionParagraphs: ["HR-0412 grew in the last day.", "Quiet elsewhere on the disk."],
    caution: CAUTION,
    unsubscribeUrl: "https://facula.example/subscriptions/u-77/unsubscribe",
    ...overrides,
  };
}

/** Holds every alert field, so it serves the alert, reminder and escalation templates. */
export function makeAlert(overrides: Partial<AlertEscalationEmail> = {}): AlertEscalationEmail {
  return {
    officeName: "Halden Ridge Space Weather Desk",
    recipientName: "Kari Vold",
    alertReference: "AL-2031-0088",
    thresholdDescription: "M+ within 24 h at 15% or more",
    bulletinVersion: 3,
    issueTimeUtc: "2031-05-06 00:30",
    raisedAtUtc: "2031-05-06 00:31",
    subscriberName: "Kari Vold",
    rows,
    caution: CAUTION,
    ackUrl: "https://facula.example/alerts/AL-2031-0088/ack?t=9f",
    unsubscribeUrl: "https://facula.example/subscriptions/u-77/unsubscribe",
    ...overrides,
  };
}
