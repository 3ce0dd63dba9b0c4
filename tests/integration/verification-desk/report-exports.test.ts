import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { getDb } from "@/db/client";
import { forecastRecords, models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { IntervalsMessage } from "@/lib/query/verification";
import { GET as exportRoute } from "@/pages/api/verification/export";
import { GET as intervalsRoute } from "@/pages/api/verification/intervals";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertReportSample, reportQuery as query } from "./report-sample";
import { callJson, callRaw, createPerson } from "./route-call";

let verifier: CurrentUser;

beforeAll(async () => {
  await useTestDatabase();
  verifier = await createPerson("verifier", "verifier@exports.example");
  await insertReportSample();
});
afterAll(closeTestDatabase);

describe("bootstrap intervals stream their progress", () => {
  it("sends progress lines then the result", async () => {
    const res = await callRaw(
      intervalsRoute,
      `/api/verification/intervals?${query({ resamples: "200" })}`,
      { user: verifier },
    );
    expect(res.headers.get("content-type")).toMatch(/ndjson/);
    const messages = (await res.text())
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l) as IntervalsMessage);
    const progress = messages.filter((m) => m.type === "progress");
    expect(progress.length).toBeGreaterThan(10);
    const last = messages[messages.length - 1]!;
    expect(last.type).toBe("result");
    if (last.type !== "result") return;
    expect(last.result.intervals.brier?.estimate.value).toBeCloseTo(0.2175, 12);
    expect(last.result.skillDifference?.estimate.value).toBeCloseTo(0.13, 12);
  });
});

describe("CSV exports", () => {
  it("exports the matched pairs as an attachment", async () => {
    const res = await callRaw(exportRoute, `/api/verification/export?${query({ what: "pairs" })}`, {
      user: verifier,
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(
      /^attachment; filename="facula-forecaster-Mplus-24h-full-disk-start_end-pairs\.csv"$/,
    );
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true });
    expect(parsed.data.map((r) => [r.probability, r.reference_probability, r.observed])).toEqual([
      ["0.9", "0.5", "1"],
      ["0.6", "0.5", "0"],
      ["0.3", "0.5", "1"],
      ["0.1", "0.5", "0"],
    ]);
  });

  it("exports the scores, writing 'undefined' and the reason instead of a number", async () => {
    const res = await callRaw(
      exportRoute,
      `/api/verification/export?${query({ what: "scores", from: "2031-07-04", to: "2031-07-04" })}`,
      { user: verifier },
    );
    const rows = Papa.parse<string[]>(await res.text()).data;
    expect(rows[0]).toEqual(["section", "score", "value", "undefined_reason"]);
    const bss = rows.find((r) => r[0] === "scores" && r[1] === "bssClimatology");
    expect(bss?.[2]).toBe("undefined");
    expect(bss?.[3]).toMatch(/no observed events/);
    // One case, p = 0.1 and o = 0: BS = 0.1² = 0.01.
    expect(Number(rows.find((r) => r[1] === "brier")?.[2])).toBeCloseTo(0.01, 15);
    const bad = await callJson(
      exportRoute,
      `/api/verification/export?${query({ what: "everything" })}`,
      { user: verifier },
    );
    expect(bad.status).toBe(400);
  });

  it("quotes a model name a spreadsheet would run as a formula, and keeps numbers plain", async () => {
    await getDb()
      .insert(models)
      .values({
        key: "odd",
        version: "v1",
        kind: "persistence",
        name: "=SUM(A1:A9)",
        provenance: "test",
        params: {},
      });
    await getDb()
      .insert(forecastRecords)
      .values({
        source: "model:odd@v1",
        issueTime: new Date("2031-07-02T06:00Z"),
        regionNumber: null,
        level: "M+",
        windowHours: 24,
        probability: 0.9,
      });
    const res = await callRaw(
      exportRoute,
      `/api/verification/export?${query({ what: "scores", source: "model:odd@v1", reference: "" })}`,
      { user: verifier },
    );
    const text = await res.text();
    const rows = Papa.parse<string[]>(text).data;
    // OWASP CSV injection guidance: a leading ' keeps the cell text.
    expect(rows.find((r) => r[1] === "source")?.[2]).toBe("'=SUM(A1:A9) v1");
    // One case, p = 0.9, no M+ flare in its window: BS = 0.81; BSS is undefined, written as such.
    expect(Number(rows.find((r) => r[1] === "brier")?.[2])).toBeCloseTo(0.81, 12);
    expect(text).not.toMatch(/'0\.8/);
  });
});
