import { cp, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import Mustache from "mustache";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clearEmailTemplateCache, renderEmail } from "@/server/email/render";
import type { EmailTemplateName } from "@/server/email/templates";
import { CAUTION, makeAlert, makeBulletin, makeInvitation } from "./email-fixtures";

const XSS = "<script>alert(1)</script>";
const QUOTES = `"&<>`;
const globalEscape = Mustache.escape;

describe("renderEmail: invitation", () => {
  it("renders subject, HTML and text with the values filled in", async () => {
    const mail = await renderEmail("invitation", makeInvitation());
    expect(mail.subject).toBe("Ilse Marr invited you to Halden Ridge Space Weather Desk on Facula");
    expect(mail.html.toLowerCase().startsWith("<!doctype html>")).toBe(true);
    expect(mail.html).toContain("Hello Ola Nordvik,");
    // In an attribute "&" must be written "&amp;" (HTML Living Standard, character references).
    expect(mail.html).toContain(
      'href="https://facula.example/invitations/accept?token=t0k3n/abc=1&amp;x=2"',
    );
    expect(mail.html).toMatch(/#1b1f3b/i);
    expect(mail.html).toMatch(/#f2a541/i);
    expect(mail.text).toContain("This link expires at 2031-05-06 14:30 UTC and can be used once.");
    expect(mail.text).toContain("https://facula.example/invitations/accept?token=t0k3n/abc=1&x=2");
    expect(mail.text).toContain("Sent by Facula for Halden Ridge Space Weather Desk.");
  });

  it("leaves no placeholder, MJML tag or markup behind", async () => {
    const mail = await renderEmail("invitation", makeInvitation());
    for (const part of [mail.subject, mail.html, mail.text]) expect(part).not.toContain("{{");
    expect(mail.html).not.toContain("<mj-");
    expect(mail.text).not.toMatch(/<[a-z]/i);
    expect(mail.text).not.toContain("&amp;");
  });

  it("greets without a name when the invitee's name is not known", async () => {
    const mail = await renderEmail("invitation", makeInvitation({ inviteeName: undefined }));
    expect(mail.text).toContain("Hello,\n");
    expect(mail.html).not.toContain("Hello Ola");
    expect(mail.html).not.toContain("undefined");
  });
});

describe("renderEmail: escaping", () => {
  const hostile = () => makeInvitation({ inviteeName: XSS, inviterName: `${QUOTES}'` });

  it("entity-encodes user text in the HTML part", async () => {
    const { html } = await renderEmail("invitation", hostile());
    expect(html).not.toContain(XSS);
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(html).not.toContain(QUOTES);
    expect(html).toContain("&quot;&amp;&lt;&gt;&#39;");
  });

  it("keeps user text literal in the text part and the subject", async () => {
    const { text, subject } = await renderEmail("invitation", hostile());
    expect(text).toContain(XSS);
    expect(text).toContain(`${QUOTES}'`);
    expect(text).not.toContain("&lt;");
    expect(text).not.toContain("&quot;");
    expect(subject).toBe(`${QUOTES}' invited you to Halden Ridge Space Weather Desk on Facula`);
  });

  it("flattens CR and LF in the subject so no header can be injected", async () => {
    const mail = await renderEmail(
      "invitation",
      makeInvitation({ inviterName: "Ilse\r\nBcc: victim@example.org\n" }),
    );
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.subject).toBe(
      "Ilse Bcc: victim@example.org invited you to Halden Ridge Space Weather Desk on Facula",
    );
  });

  it("does not change Mustache's global escaping", async () => {
    await renderEmail("invitation", hostile());
    expect(Mustache.escape).toBe(globalEscape);
    // mustache.js's own map encodes "/" as &#x2F; (node_modules/mustache/mustache.js, entityMap).
    expect(Mustache.render("{{v}}", { v: "</b>" })).toBe("&lt;&#x2F;b&gt;");
  });
});

describe("renderEmail: refusals", () => {
  it("rejects an unknown template name, including a path", async () => {
    const data = makeInvitation() as never;
    await expect(renderEmail("nope" as EmailTemplateName, data)).rejects.toThrow(
      'Unknown e-mail template "nope"',
    );
    await expect(renderEmail("../package" as EmailTemplateName, data)).rejects.toThrow(
      /Unknown e-mail template/,
    );
  });

  it("names every missing required value instead of rendering blanks", async () => {
    const data = makeInvitation({ acceptUrl: "", roleLabel: undefined as unknown as string });
    const attempt = renderEmail("invitation", data);
    await expect(attempt).rejects.toThrow(/roleLabel is required/);
    await expect(attempt).rejects.toThrow(/acceptUrl is required/);
  });

  it("rejects links that are not absolute http(s) URLs", async () => {
    for (const acceptUrl of ["javascript:alert(1)", "/invitations/accept", "data:text/html,x"]) {
      await expect(renderEmail("invitation", makeInvitation({ acceptUrl }))).rejects.toThrow(
        /acceptUrl must be an absolute http\(s\) URL/,
      );
    }
    const plainHttp = makeInvitation({ acceptUrl: "http://127.0.0.1:4321/invitations/accept" });
    await expect(renderEmail("invitation", plainHttp)).resolves.toHaveProperty("html");
  });
});

describe("renderEmail: templates directory and cache", () => {
  let dir = "";

  beforeAll(async () => {
    dir = await mkdtemp(path.join(os.tmpdir(), "facula-emails-"));
    await cp(path.join(process.cwd(), "emails"), dir, { recursive: true });
  });
  afterAll(async () => {
    clearEmailTemplateCache();
    await rm(dir, { recursive: true, force: true });
  });

  it("reads from the given directory and keeps templates cached until cleared", async () => {
    const textFile = path.join(dir, "invitation.txt");
    const original = await readFile(textFile, "utf8");
    await writeFile(textFile, `FIRST-COPY\n${original}`);
    expect(
      (await renderEmail("invitation", makeInvitation(), { templatesDir: dir })).text,
    ).toContain("FIRST-COPY");
    expect((await renderEmail("invitation", makeInvitation())).text).not.toContain("FIRST-COPY");

    await writeFile(textFile, `SECOND-COPY\n${original}`);
    const cached = await renderEmail("invitation", makeInvitation(), { templatesDir: dir });
    expect(cached.text).toContain("FIRST-COPY");
    clearEmailTemplateCache();
    const fresh = await renderEmail("invitation", makeInvitation(), { templatesDir: dir });
    expect(fresh.text).toContain("SECOND-COPY");
  });

  it("fails loudly on MJML that strict validation refuses", async () => {
    const mjmlFile = path.join(dir, "alert.mjml");
    const original = await readFile(mjmlFile, "utf8");
    await expect(renderEmail("alert", makeAlert(), { templatesDir: dir })).resolves.toBeTruthy();
    // "colr" is not an mj-text attribute: soft validation would only warn and still send.
    await writeFile(
      mjmlFile,
      original.replace('<mj-text mj-class="heading">', '<mj-text colr="red">'),
    );
    clearEmailTemplateCache();
    await expect(renderEmail("alert", makeAlert(), { templatesDir: dir })).rejects.toThrow(
      /"alert" is not valid MJML.*colr/s,
    );
    await writeFile(mjmlFile, original);
    clearEmailTemplateCache();
  });

  it("fails on a partial that does not exist instead of rendering nothing", async () => {
    const textFile = path.join(dir, "bulletin.txt");
    await writeFile(textFile, `{{> no-such-partial}}\n${await readFile(textFile, "utf8")}`);
    clearEmailTemplateCache();
    await expect(renderEmail("bulletin", makeBulletin(), { templatesDir: dir })).rejects.toThrow(
      /unknown partial "no-such-partial"/,
    );
  });
});

describe("renderEmail: caution on every bulletin and alert", () => {
  const cases: Array<[EmailTemplateName, () => object]> = [
    ["bulletin", () => makeBulletin()],
    ["alert", () => makeAlert()],
    ["alert-reminder", () => makeAlert()],
    ["alert-escalation", () => makeAlert()],
  ];

  it.each(cases)("%s shows the caution in both parts", async (name, make) => {
    const mail = await renderEmail(name, make() as never);
    expect(mail.html).toContain(CAUTION);
    expect(mail.html).toContain("CAUTION");
    expect(mail.text).toContain(`CAUTION\n${CAUTION}`);
  });

  it.each(cases)("%s refuses to render without a caution", async (name, make) => {
    await expect(renderEmail(name, { ...make(), caution: " " } as never)).rejects.toThrow(
      /caution is required/,
    );
  });
});
