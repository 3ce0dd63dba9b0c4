import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as create } from "@/pages/api/bulletins/index";
import { GET as read, PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as submit } from "@/pages/api/bulletins/[id]/submit";
import { POST as sendBack } from "@/pages/api/bulletins/[id]/return";
import { POST as reopen } from "@/pages/api/bulletins/[id]/reopen";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, auditActionsFor, call, countWhere, seedDesk, type Desk } from "./desk-fixture";

const DAY = "2031-05-06";
let desk: Desk;
let id: number;
const p = () => ({ id: String(id) });

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
  await assessDay(DAY, desk.forecaster);
});
afterAll(closeTestDatabase);

describe("a bulletin from draft to issued", () => {
  it("starts as a draft, version 1, and a second start for the day answers 409 with the open one's id", async () => {
    const first = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: DAY,
    });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      status: "draft",
      version: 1,
      forecastDay: DAY,
      supersedesId: null,
    });
    id = first.body.id;
    const again = await call(create, "/api/bulletins", "POST", desk.dutyA, { forecastDay: DAY });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.existingId).toBe(String(id));
    expect(again.body.error.message).toContain(`#${id}`);
  });

  it("computes the content live: finals for HR-0412, blended guidance for HR-0413", async () => {
    const { body } = await call(
      read,
      `/api/bulletins/${id}`,
      "GET",
      desk.forecaster,
      undefined,
      p(),
    );
    expect(
      body.content.regions.map((r: { region: string; probabilitySource: string }) => [
        r.region,
        r.probabilitySource,
      ]),
    ).toEqual([
      ["HR-0412", "final"],
      ["HR-0413", "guidance"],
    ]);
    expect(body.content.regions[0].probabilities["M+"]["24h"]).toBe(0.2);
    expect(body.content.fullDisk["C+"]["24h"]).toBeGreaterThan(0.6);
    expect(body.problems).toEqual(["Write the forecaster's discussion."]);
    expect(body.actions.sort()).toEqual(["edit", "submit"]);
  });

  it("will not submit without a discussion (422), and keeps it a draft", async () => {
    const refused = await call(submit, "/", "POST", desk.forecaster, undefined, p());
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/discussion/);
    expect((await call(read, "/", "GET", desk.forecaster, undefined, p())).body.status).toBe(
      "draft",
    );
  });

  it("edits the discussion with the revision seen, and refuses a stale revision or unknown fields", async () => {
    const before = (await call(read, "/", "GET", desk.forecaster, undefined, p())).body;
    const saved = await call(
      edit,
      "/",
      "PATCH",
      desk.forecaster,
      { discussion: "HR-0412 keeps growing.", revision: before.revision },
      p(),
    );
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({
      discussion: "HR-0412 keeps growing.",
      revision: before.revision + 1,
      problems: [],
    });
    const stale = await call(
      edit,
      "/",
      "PATCH",
      desk.forecaster,
      { discussion: "late", revision: before.revision },
      p(),
    );
    expect(stale.status).toBe(409);
    expect(
      (await call(edit, "/", "PATCH", desk.forecaster, { discussion: "x", status: "issued" }, p()))
        .status,
    ).toBe(400);
  });

  it("submits, then a duty officer returns it only with a comment", async () => {
    expect((await call(submit, "/", "POST", desk.forecaster, undefined, p())).body.status).toBe(
      "in_review",
    );
    expect((await call(submit, "/", "POST", desk.forecaster, undefined, p())).status).toBe(409);
    expect(
      (await call(edit, "/", "PATCH", desk.forecaster, { discussion: "while in review" }, p()))
        .status,
    ).toBe(409);
    expect((await call(sendBack, "/", "POST", desk.forecaster, { comment: "x" }, p())).status).toBe(
      403,
    );
    const noComment = await call(sendBack, "/", "POST", desk.dutyA, { comment: "  " }, p());
    expect(noComment.status).toBe(400);
    expect(noComment.body.error.fields.comment).toBeTruthy();
    const returned = await call(
      sendBack,
      "/",
      "POST",
      desk.dutyA,
      { comment: "Say why HR-0413 is left on guidance." },
      p(),
    );
    expect(returned.status).toBe(200);
    expect(returned.body.status).toBe("returned");
    expect(returned.body.comments.map((c: { body: string }) => c.body)).toEqual([
      "Say why HR-0413 is left on guidance.",
    ]);
    expect(await countWhere("bulletin_comments", id)).toBe(1);
  });

  it("reopens, is edited and resubmitted", async () => {
    expect((await call(reopen, "/", "POST", desk.forecaster, undefined, p())).body.status).toBe(
      "draft",
    );
    expect((await call(reopen, "/", "POST", desk.forecaster, undefined, p())).status).toBe(409);
    const edited = await call(
      edit,
      "/",
      "PATCH",
      desk.forecaster,
      { discussion: "HR-0412 keeps growing.\n\nHR-0413 is small and stable: guidance stands." },
      p(),
    );
    expect(edited.body.status).toBe("draft");
    expect((await call(submit, "/", "POST", desk.forecaster, undefined, p())).body.status).toBe(
      "in_review",
    );
  });

  it("never lets the author approve (403), and offers approval to the other duty officer", async () => {
    const byAuthor = await call(approve, "/", "POST", desk.forecaster, undefined, p());
    expect(byAuthor.status).toBe(403);
    // dutyA returned it but did not edit it: returning does not make anyone an author.
    const view = await call(read, "/", "GET", desk.dutyA, undefined, p());
    expect(view.body.actions.sort()).toEqual(["approve", "return"]);
    expect((await call(read, "/", "GET", desk.forecaster, undefined, p())).body.actions).toEqual(
      [],
    );
  });

  it("is issued by another duty officer, with the content frozen and the issue time set", async () => {
    const view = (await call(read, "/", "GET", desk.dutyA, undefined, p())).body;
    const issued = await call(
      approve,
      "/",
      "POST",
      desk.dutyA,
      { revision: view.revision, contentHash: view.contentHash },
      p(),
    );
    expect(issued.status).toBe(200);
    expect(issued.body.status).toBe("issued");
    expect(issued.body.approverName).toBe("Test duty_officer");
    expect(issued.body.content.issueTime).toBe(issued.body.issueTime);
    expect(issued.body.content.isDemo).toBe(true);
    expect(issued.body.issue.forecastRecords).toBeGreaterThan(0);
    expect(issued.body.issue.deliveries).toBe(1);
    expect(issued.body.issue.alerts).toBe(1);
  });

  it("wrote one audit row per transition, in order", async () => {
    expect(await auditActionsFor(id)).toEqual([
      "bulletin.created",
      "bulletin.edited",
      "bulletin.submitted",
      "bulletin.returned",
      "bulletin.reopened",
      "bulletin.edited",
      "bulletin.submitted",
      "dissemination.queued",
      "bulletin.approved_issued",
    ]);
  });
});
