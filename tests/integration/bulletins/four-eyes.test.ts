import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as create } from "@/pages/api/bulletins/index";
import { GET as read, PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as submit } from "@/pages/api/bulletins/[id]/submit";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, call, seedDesk, type Desk } from "./desk-fixture";
import { readyForReview } from "./bulletin-steps";

let desk: Desk;

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
});
afterAll(closeTestDatabase);

describe("four-eyes with a duty officer as author or editor", () => {
  it("refuses approval by a duty officer who edited someone else's draft", async () => {
    await assessDay("2031-06-02", desk.forecaster);
    const created = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-06-02",
    });
    const p = { id: String(created.body.id) };
    expect(
      (await call(edit, "/", "PATCH", desk.dutyA, { discussion: "Tidied by the duty officer." }, p))
        .status,
    ).toBe(200);
    await call(submit, "/", "POST", desk.forecaster, undefined, p);
    const byEditor = await call(approve, "/", "POST", desk.dutyA, undefined, p);
    expect(byEditor.status).toBe(403);
    expect(byEditor.body.error.message).toMatch(/edited or submitted/);
    expect((await call(read, "/", "GET", desk.dutyA, undefined, p)).body.actions).toEqual([
      "return",
    ]);
    expect((await call(approve, "/", "POST", desk.dutyB, undefined, p)).status).toBe(200);
  });

  it("refuses a stale content fingerprint (409) and leaves the bulletin in review", async () => {
    await assessDay("2031-06-03", desk.forecaster);
    const id = await readyForReview("2031-06-03", desk.dutyA);
    const p = { id: String(id) };
    const stale = await call(approve, "/", "POST", desk.dutyB, { contentHash: "0".repeat(64) }, p);
    expect(stale.status).toBe(409);
    expect((await call(approve, "/", "POST", desk.dutyA, undefined, p)).status).toBe(403);
    expect((await call(read, "/", "GET", desk.dutyB, undefined, p)).body.status).toBe("in_review");
  });
});
