import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { APIRoute } from "astro";
import { DEFAULT_OFFICE_SETTINGS } from "@/lib/schemas/settings";
import { POST as create } from "@/pages/api/bulletins/index";
import { PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as submit } from "@/pages/api/bulletins/[id]/submit";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { POST as withdraw } from "@/pages/api/bulletins/[id]/withdraw";
import { GET as emailHtml } from "@/pages/api/bulletins/[id]/email.html";
import { GET as feed } from "@/pages/api/feed/bulletins";
import { saveOfficeSettings } from "@/server/settings/settings.db";
import type { CurrentUser } from "@/lib/auth/roles";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, call, seedDesk, type Desk } from "./desk-fixture";

let desk: Desk;
const ids: Record<string, number> = {};

async function issue(day: string): Promise<number> {
  const created = await call(create, "/api/bulletins", "POST", desk.forecaster, {
    forecastDay: day,
  });
  const p = { id: String(created.body.id) };
  await call(edit, "/", "PATCH", desk.forecaster, { discussion: `Outlook for ${day}.` }, p);
  await call(submit, "/", "POST", desk.forecaster, undefined, p);
  const issued = await call(approve, "/", "POST", desk.dutyA, undefined, p);
  expect(issued.status).toBe(200);
  return created.body.id;
}

async function raw(
  route: APIRoute,
  path: string,
  user: CurrentUser | null,
  params: Record<string, string> = {},
) {
  const request = new Request(`http://127.0.0.1${path}`);
  return route({
    request,
    url: new URL(request.url),
    params,
    locals: { user, requestId: "test" },
  } as never);
}

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
  await assessDay("2031-07-01", desk.forecaster);
  await assessDay("2031-07-02", desk.forecaster);
  ids.first = await issue("2031-07-01");
  ids.correction = await issue("2031-07-01");
  ids.second = await issue("2031-07-02");
  await call(
    withdraw,
    "/",
    "POST",
    desk.dutyB,
    { reason: "Issued with the wrong region list." },
    { id: String(ids.second) },
  );
  ids.draft = (
    await call(create, "/api/bulletins", "POST", desk.forecaster, { forecastDay: "2031-07-03" })
  ).body.id;
});
afterAll(closeTestDatabase);

describe("the bulletin feed", () => {
  it("needs a signed-in reader while the office keeps bulletins private", async () => {
    expect((await call(feed, "/api/feed/bulletins", "GET", null)).status).toBe(401);
    expect((await call(feed, "/api/feed/bulletins", "GET", desk.subscriber)).status).toBe(200);
  });

  it("lists published versions newest first, marked, and never a draft", async () => {
    const { body } = await call(feed, "/api/feed/bulletins", "GET", desk.subscriber);
    expect(body.feedVersion).toBe(1);
    expect(body.office.name).toBe(DEFAULT_OFFICE_SETTINGS.officeName);
    expect(Date.parse(body.generatedAt)).not.toBeNaN();
    expect(body.bulletins.map((b: { id: number; status: string }) => [b.id, b.status])).toEqual([
      [ids.second, "withdrawn"],
      [ids.correction, "issued"],
      [ids.first, "superseded"],
    ]);
    const [withdrawn, correction, first] = body.bulletins;
    expect(withdrawn.withdrawnReason).toBe("Issued with the wrong region list.");
    expect(correction.supersedes).toEqual({ id: ids.first, version: 1 });
    expect(first.supersededBy).toEqual({ id: ids.correction, version: 2 });
    expect(first.supersedes).toBeNull();
    expect(body.bulletins.some((b: { id: number }) => b.id === ids.draft)).toBe(false);
  });

  it("gives each bulletin its validity windows from the issue time and its full content", async () => {
    const { body } = await call(feed, "/api/feed/bulletins", "GET", desk.subscriber);
    const b = body.bulletins[1];
    const start = Date.parse(b.issueTime);
    expect(
      b.validity.map((w: { hours: number; start: string; end: string }) => [
        w.hours,
        Date.parse(w.start) - start,
        (Date.parse(w.end) - start) / 3_600_000,
      ]),
    ).toEqual([
      [24, 0, 24],
      [48, 0, 48],
      [72, 0, 72],
    ]);
    expect(Object.keys(b.fullDisk).sort()).toEqual(["C+", "M+", "X"]);
    expect(b.regions.map((r: { region: string }) => r.region)).toEqual(["HR-0412", "HR-0413"]);
    expect(b.cautions.length).toBeGreaterThan(0);
    expect(b.discussion).toBe("Outlook for 2031-07-01.");
    expect(b.isDemo).toBe(true);
  });

  it("pages with ?limit and ?before, and says when there is no next page", async () => {
    const page1 = (await call(feed, "/api/feed/bulletins?limit=2", "GET", desk.subscriber)).body;
    expect(page1.bulletins.map((b: { id: number }) => b.id)).toEqual([ids.second, ids.correction]);
    expect(page1.nextBefore).toBe(page1.bulletins[1].issueTime);
    const page2 = (
      await call(
        feed,
        `/api/feed/bulletins?limit=2&before=${encodeURIComponent(page1.nextBefore)}`,
        "GET",
        desk.subscriber,
      )
    ).body;
    expect(page2.bulletins.map((b: { id: number }) => b.id)).toEqual([ids.first]);
    expect(page2.nextBefore).toBeNull();
  });

  it("refuses malformed paging with field messages", async () => {
    for (const q of ["limit=0", "limit=101", "before=yesterday", "page=2"]) {
      const answer = await call(feed, `/api/feed/bulletins?${q}`, "GET", desk.subscriber);
      expect(answer.status, q).toBe(400);
    }
  });

  it("is public once the office allows public bulletins, and private again when it stops", async () => {
    await saveOfficeSettings({ ...DEFAULT_OFFICE_SETTINGS, isPublicBulletinsAllowed: true }, null);
    const open = await call(feed, "/api/feed/bulletins", "GET", null);
    expect(open.status).toBe(200);
    expect(open.body.bulletins).toHaveLength(3);
    await saveOfficeSettings({ ...DEFAULT_OFFICE_SETTINGS, isPublicBulletinsAllowed: false }, null);
    expect((await call(feed, "/api/feed/bulletins", "GET", null)).status).toBe(401);
  });
});

describe("the e-mail preview frame", () => {
  it("serves the HTML part with its own CSP that only this site may frame", async () => {
    const res = await raw(
      emailHtml,
      `/api/bulletins/${ids.correction}/email.html`,
      desk.subscriber,
      { id: String(ids.correction) },
    );
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("text/html");
    expect(res.headers.get("content-security-policy")).toContain("frame-ancestors 'self'");
    expect(res.headers.get("content-security-policy")).toContain("default-src 'none'");
    const html = await res.text();
    expect(html).toContain("HR-0412");
    expect(html).toContain("supersedes version 1");
  });

  it("refuses a subscriber a draft's e-mail, and a signed-out visitor any", async () => {
    expect((await raw(emailHtml, "/", desk.subscriber, { id: String(ids.draft) })).status).toBe(
      403,
    );
    expect((await raw(emailHtml, "/", null, { id: String(ids.first) })).status).toBe(401);
    expect((await raw(emailHtml, "/", desk.forecaster, { id: String(ids.draft) })).status).toBe(
      409,
    );
  });
});
