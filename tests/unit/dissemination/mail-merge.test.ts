import { describe, expect, it } from "vitest";
import { fillMerge, hasUnfilledField, MERGE_FIELDS } from "@/server/dissemination/mail-merge";

const template = {
  subject: `Alert for ${MERGE_FIELDS.subscriber}`,
  html: `<p>Hello ${MERGE_FIELDS.name},</p><a href="https://desk.example/ack?token=${MERGE_FIELDS.ackToken}">Acknowledge</a>`,
  text: `Hello ${MERGE_FIELDS.name},\nhttps://desk.example/ack?token=${MERGE_FIELDS.ackToken}\n`,
};

describe("fillMerge", () => {
  it("puts each recipient's values in every part", () => {
    const mail = fillMerge(template, { name: "Dana", subscriber: "Rui", ackToken: "abc.def" });
    expect(mail.subject).toBe("Alert for Rui");
    expect(mail.html).toBe(
      '<p>Hello Dana,</p><a href="https://desk.example/ack?token=abc.def">Acknowledge</a>',
    );
    expect(mail.text).toBe("Hello Dana,\nhttps://desk.example/ack?token=abc.def\n");
  });

  it("encodes HTML in the HTML part only (OWASP XSS Prevention Cheat Sheet, rule 1)", () => {
    const mail = fillMerge(template, {
      name: `<b>"O'Neil" & co</b>`,
      subscriber: "x",
      ackToken: "t",
    });
    expect(mail.html).toContain("Hello &lt;b&gt;&quot;O&#39;Neil&quot; &amp; co&lt;/b&gt;,");
    expect(mail.html).not.toContain("<b>");
    expect(mail.text).toContain(`Hello <b>"O'Neil" & co</b>,`);
  });

  it("keeps a subject on one line: line breaks in a value cannot add a header", () => {
    const mail = fillMerge(template, {
      name: "a",
      subscriber: "Rui\r\nBcc: someone@example.org",
      ackToken: "t",
    });
    expect(mail.subject).toBe("Alert for Rui Bcc: someone@example.org");
    expect(mail.subject).not.toMatch(/[\r\n]/);
  });

  it("refuses to produce a copy with a placeholder left over", () => {
    expect(() => fillMerge(template, { name: "Dana", subscriber: "Rui" })).toThrow(/placeholder/);
    expect(hasUnfilledField(template.html)).toBe(true);
    expect(hasUnfilledField("Hello Dana")).toBe(false);
  });
});
