import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as list, POST as create } from "@/pages/api/bulletins/index";
import { GET as read } from "@/pages/api/bulletins/[id]/index";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, call, seedDesk, type Desk } from "./desk-fixture";
import { issueDay } from "./bulletin-steps";

const DAY = "2031-05-06";
let desk: Desk;
let id: number;
const p = () => ({ id: String(id) });

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
  await assessDay(DAY, desk.forecaster);
  id = await issueDay(DAY, desk.forecaster, desk.dutyA);
});
afterAll(closeTestDatabase);

describe("who reads what", () => {
  it("refuses roles that may not draft, and bad days", async () => {
    expect(
      (await call(create, "/api/bulletins", "POST", desk.subscriber, { forecastDay: "2031-05-07" }))
        .status,
    ).toBe(403);
    expect(
      (await call(create, "/api/bulletins", "POST", desk.verifier, { forecastDay: "2031-05-07" }))
        .status,
    ).toBe(403);
    expect(
      (await call(create, "/api/bulletins", "POST", null, { forecastDay: "2031-05-07" })).status,
    ).toBe(401);
    const bad = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-02-30",
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.forecastDay).toBeTruthy();
  });

  it("lets subscribers read issued bulletins but not drafts (403), and lists published ones only", async () => {
    expect((await call(read, "/", "GET", desk.subscriber, undefined, p())).status).toBe(200);
    const draft = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-05-07",
    });
    expect(draft.status).toBe(201);
    expect(
      (await call(read, "/", "GET", desk.subscriber, undefined, { id: String(draft.body.id) }))
        .status,
    ).toBe(403);
    expect(
      (await call(read, "/", "GET", desk.verifier, undefined, { id: String(draft.body.id) }))
        .status,
    ).toBe(200);
    const mine = await call(list, "/api/bulletins", "GET", desk.subscriber);
    expect(mine.body.bulletins.map((b: { id: number }) => b.id)).toEqual([id]);
    expect((await call(list, "/api/bulletins?status=draft", "GET", desk.subscriber)).status).toBe(
      403,
    );
    const staff = await call(list, "/api/bulletins", "GET", desk.verifier);
    expect(staff.body.total).toBe(2);
  });

  it("filters the list by status and day and pages it", async () => {
    const drafts = await call(list, "/api/bulletins?status=draft", "GET", desk.forecaster);
    expect(drafts.body.bulletins.map((b: { forecastDay: string }) => b.forecastDay)).toEqual([
      "2031-05-07",
    ]);
    const day = await call(list, `/api/bulletins?day=${DAY}`, "GET", desk.forecaster);
    expect(day.body.bulletins.map((b: { id: number }) => b.id)).toEqual([id]);
    const page2 = await call(list, "/api/bulletins?page=2&pageSize=5", "GET", desk.forecaster);
    expect(page2.body).toMatchObject({ bulletins: [], total: 2, page: 2 });
    expect(
      (await call(list, "/api/bulletins?status=approved", "GET", desk.forecaster)).status,
    ).toBe(400);
  });

  it("answers 404 for an unknown bulletin and 400 for a malformed id", async () => {
    expect((await call(read, "/", "GET", desk.forecaster, undefined, { id: "9999" })).status).toBe(
      404,
    );
    expect((await call(read, "/", "GET", desk.forecaster, undefined, { id: "abc" })).status).toBe(
      400,
    );
  });
});
