import { describe, expect, it } from "vitest";
import { renderEmail } from "@/server/email/render";
import { makeAlert, makeBulletin } from "./email-fixtures";

// The cell text follows the opening tag, whatever inline style juice added to the <td>.
const cell = (value: string) => new RegExp(`<td[^>]*>\\s*${value.replace("+", "\\+")}\\s*</td>`);

describe("renderEmail: bulletin", () => {
  it("lists every full-disk row in the HTML table and the text", async () => {
    const mail = await renderEmail("bulletin", makeBulletin());
    expect(mail.subject).toBe(
      "Halden Ridge Space Weather Desk flare-risk bulletin v3, issued 2031-05-06 00:30 UTC",
    );
    for (const value of ["C+", "M+", "X", "45%", "62%", "71%", "12%", "27%"]) {
      expect(mail.html).toMatch(cell(value));
    }
    expect(mail.text).toContain("- C+: 45% in 24 h, 62% in 48 h, 71% in 72 h");
    expect(mail.text).toContain("- X: 2% in 24 h, 3% in 48 h, 5% in 72 h");
    expect(mail.html).not.toMatch(cell("99%"));
  });

  it("lists the active regions, or says there are none", async () => {
    const withRegion = await renderEmail("bulletin", makeBulletin());
    expect(withRegion.html).toMatch(cell("HR-0412"));
    expect(withRegion.html).toMatch(cell("beta-gamma-delta"));
    expect(withRegion.text).toContain("- HR-0412 at N12E34, Dkc / beta-gamma-delta, 480 MSH");
    expect(withRegion.html).not.toContain("No numbered active regions");

    const empty = await renderEmail("bulletin", makeBulletin({ regions: [] }));
    expect(empty.html).toContain("No numbered active regions on the visible disk.");
    expect(empty.text).toContain("No numbered active regions on the visible disk.");
    expect(empty.html).not.toMatch(cell("HR-0412"));
    expect(empty.html).not.toContain("Mt Wilson");
  });

  it("shows the discussion paragraphs and marks a correction only when there is one", async () => {
    const plain = await renderEmail("bulletin", makeBulletin());
    expect(plain.html).toContain("HR-0412 grew in the last day.");
    expect(plain.text).toContain("HR-0412 grew in the last day.\n\nQuiet elsewhere on the disk.");
    expect(plain.text).not.toContain("supersedes");

    const correction = await renderEmail("bulletin", makeBulletin({ supersedesVersion: 2 }));
    expect(correction.html).toContain("this version supersedes version 2.");
    expect(correction.text).toContain("Correction: this version supersedes version 2.");
  });

  it("refuses a bulletin whose table rows are not a list", async () => {
    const broken = makeBulletin({ rows: "C+ 45%" as never });
    await expect(renderEmail("bulletin", broken)).rejects.toThrow(/rows must be a list/);
  });
});

describe("renderEmail: footer", () => {
  it("offers an unsubscribe link only when one is given", async () => {
    const url = "https://facula.example/subscriptions/u-77/unsubscribe";
    const withLink = await renderEmail("alert", makeAlert());
    expect(withLink.html).toContain(`href="${url}"`);
    expect(withLink.text).toContain(`Unsubscribe from these e-mails: ${url}`);

    const without = await renderEmail("alert", makeAlert({ unsubscribeUrl: undefined }));
    expect(without.html).not.toContain("Unsubscribe");
    expect(without.text).not.toContain("Unsubscribe");
    expect(without.text).toContain("Sent by Facula for Halden Ridge Space Weather Desk.");
  });
});

describe("renderEmail: alerts", () => {
  it("puts the threshold in the subject and the acknowledgement link in both parts", async () => {
    const mail = await renderEmail("alert", makeAlert());
    expect(mail.subject).toBe(
      "Flare-risk alert: M+ within 24 h at 15% or more (Halden Ridge Space Weather Desk)",
    );
    expect(mail.html).toContain('href="https://facula.example/alerts/AL-2031-0088/ack?t=9f"');
    expect(mail.text).toContain("https://facula.example/alerts/AL-2031-0088/ack?t=9f");
    expect(mail.html).toMatch(cell("45%"));
  });

  it("reminds with the time the alert was raised", async () => {
    const mail = await renderEmail("alert-reminder", makeAlert());
    expect(mail.subject).toContain("Reminder, please acknowledge");
    expect(mail.text).toContain("raised at 2031-05-06 00:31 UTC, has not been acknowledged yet");
    await expect(renderEmail("alert-reminder", makeAlert({ raisedAtUtc: "" }))).rejects.toThrow(
      /raisedAtUtc is required/,
    );
  });

  it("escalates naming the subscriber who has not acknowledged", async () => {
    const mail = await renderEmail("alert-escalation", makeAlert({ subscriberName: "Per <Ops>" }));
    expect(mail.subject).toBe("Unacknowledged alert for Per <Ops>: M+ within 24 h at 15% or more");
    expect(mail.html).toContain("Per &lt;Ops&gt;");
    expect(mail.html).not.toContain("Per <Ops>");
    expect(mail.text).toContain("Per <Ops> has not acknowledged alert AL-2031-0088");
    await expect(
      renderEmail("alert-escalation", makeAlert({ subscriberName: undefined as never })),
    ).rejects.toThrow(/subscriberName is required/);
  });

  it("does not need the escalation fields for a first alert", async () => {
    const { raisedAtUtc: _r, subscriberName: _s, ...first } = makeAlert();
    await expect(renderEmail("alert", first)).resolves.toHaveProperty("text");
  });
});
