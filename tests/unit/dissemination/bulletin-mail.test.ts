import { describe, expect, it } from "vitest";
import { BULLETIN_CAUTIONS } from "@/lib/domain/cautions";
import { buildGrid } from "@/lib/domain/flare-levels";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";
import { renderBulletinMail, toBulletinEmail } from "@/server/dissemination/bulletin-mail";
import {
  formatMailPercent,
  formatMailTime,
  splitParagraphs,
} from "@/server/dissemination/mail-values";

// Invented bulletin (demo — invented for the scenario).
const grid = buildGrid(
  (level, window) =>
    ({ "C+": 0.62, "M+": 0.21, X: 0.004 })[level] + { "24h": 0, "48h": 0.05, "72h": 0.1 }[window],
);
const bulletin: IssuedBulletin = {
  id: 41,
  forecastDay: "2026-05-04",
  version: 2,
  issueTime: new Date("2026-05-04T00:30:00Z"),
  officeName: "Halden Ridge Space Weather Desk (demo)",
  contactLine: "Duty desk (demo)",
  fullDisk: grid,
  regions: [
    {
      region: "HR-0412",
      location: "N12W71",
      isLimbFlagged: true,
      areaMsh: 480,
      mcintosh: "Dkc",
      mountWilson: "beta-gamma-delta",
      probabilities: grid,
    },
  ],
  discussion: "HR-0412 grew.\nIts delta spot persists.\n\nQuiet elsewhere.",
  cautions: [...BULLETIN_CAUTIONS],
  supersedesVersion: 1,
  isDemo: true,
};

describe("mail values", () => {
  it("write whole percentages and keep a small risk from reading as none", () => {
    expect([0.21, 0.214, 0.004, 0, 0.996, 1].map(formatMailPercent)).toEqual([
      "21%",
      "21%",
      "<1%",
      "0%",
      ">99%",
      "100%",
    ]);
    expect(formatMailTime(new Date("2026-05-04T00:30:59Z"))).toBe("2026-05-04 00:30");
    expect(splitParagraphs("a\nb\n\n\n c ")).toEqual(["a b", "c"]);
  });
});

describe("renderBulletinMail", () => {
  it("maps the frozen bulletin into the template's values", () => {
    const data = toBulletinEmail(bulletin, {
      unsubscribeUrl: "https://desk.example/unsubscribe?token=t",
    });
    expect(data.rows).toEqual([
      { level: "C+", p24: "62%", p48: "67%", p72: "72%" },
      { level: "M+", p24: "21%", p48: "26%", p72: "31%" },
      { level: "X", p24: "<1%", p48: "5%", p72: "10%" },
    ]);
    expect(data.regions[0]).toMatchObject({
      regionNumber: "HR-0412",
      location: "N12W71 (limb)",
      x24: "<1%",
    });
    expect(data.discussionParagraphs).toEqual([
      "HR-0412 grew. Its delta spot persists.",
      "Quiet elsewhere.",
    ]);
    expect(data.caution).toBe(BULLETIN_CAUTIONS.join(" "));
    expect(data.supersedesVersion).toBe(1);
    expect(
      toBulletinEmail({ ...bulletin, supersedesVersion: null }).supersedesVersion,
    ).toBeUndefined();
  });

  it("renders subject, HTML and text with the unsubscribe link only when given", async () => {
    const mail = await renderBulletinMail(bulletin, {
      unsubscribeUrl: "https://desk.example/unsubscribe?token=abc.def",
    });
    expect(mail.subject).toBe(
      "Halden Ridge Space Weather Desk (demo) flare-risk bulletin v2, issued 2026-05-04 00:30 UTC",
    );
    expect(mail.html).toContain('href="https://desk.example/unsubscribe?token=abc.def"');
    expect(mail.text).toContain("- M+: 21% in 24 h, 26% in 48 h, 31% in 72 h");
    expect(mail.text).toContain("Correction: this version supersedes version 1.");
    const plain = await renderBulletinMail(bulletin);
    expect(plain.text).not.toContain("Unsubscribe");
  });
});
