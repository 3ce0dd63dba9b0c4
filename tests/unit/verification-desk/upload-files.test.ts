import { describe, expect, it } from "vitest";
import { AppError } from "@/server/http/errors";
import { EVENT_ALIASES, REQUIRED_EVENT_FIELDS } from "@/server/verification-desk/event-rows";
import { checkExternalRows, checkExternalValues } from "@/server/verification-desk/external-rows";
import { readCsvRows, readJsonRows } from "@/server/verification-desk/table-file";
import { buildUploadPreview } from "@/server/verification-desk/upload-preview";

const read = (text: string, maxRows = 100) =>
  readCsvRows(text, EVENT_ALIASES, REQUIRED_EVENT_FIELDS, maxRows);

function refusal(fn: () => unknown): AppError {
  try {
    fn();
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected a refusal");
}

describe("reading event tables", () => {
  it("matches header spellings to fields and trims cells", () => {
    const rows = read(
      "Begin, Max ,End,GOES class,AR\n2031-05-01T06:10Z, 2031-05-01T06:24Z ,2031-05-01T06:40Z,M2.5,HR-0412\n\n",
    );
    expect(rows).toEqual([
      {
        start: "2031-05-01T06:10Z",
        peak: "2031-05-01T06:24Z",
        end: "2031-05-01T06:40Z",
        goesClass: "M2.5",
        region: "HR-0412",
      },
    ]);
  });

  it("names a missing required column and refuses empty and oversized tables", () => {
    expect(refusal(() => read("start,peak,end\n1,2,3")).message).toMatch(
      /no column for "goesClass"/,
    );
    expect(refusal(() => read("start,peak,end,class\n")).message).toBe(
      "The file has no data rows.",
    );
    const big = ["start,peak,end,class", ...Array.from({ length: 11 }, () => "a,b,c,M1")].join(
      "\n",
    );
    expect(refusal(() => read(big, 10)).message).toMatch(/11 rows; send at most 10/);
    expect(read(big, 11)).toHaveLength(11);
  });

  it("reads JSON arrays and { events: [...] }, and refuses anything else", () => {
    const item = {
      start: "2031-05-01T06:10Z",
      peak: "2031-05-01T06:24Z",
      end: "2031-05-01T06:40Z",
      class: "X1.2",
      region: null,
    };
    const expected = [
      { start: item.start, peak: item.peak, end: item.end, goesClass: "X1.2", region: "" },
    ];
    expect(readJsonRows(JSON.stringify([item]), EVENT_ALIASES, REQUIRED_EVENT_FIELDS, 10)).toEqual(
      expected,
    );
    expect(
      readJsonRows(JSON.stringify({ events: [item] }), EVENT_ALIASES, REQUIRED_EVENT_FIELDS, 10),
    ).toEqual(expected);
    expect(
      refusal(() => readJsonRows("{ nope", EVENT_ALIASES, REQUIRED_EVENT_FIELDS, 10)).message,
    ).toBe("The file is not valid JSON.");
    expect(
      refusal(() => readJsonRows('{"x":1}', EVENT_ALIASES, REQUIRED_EVENT_FIELDS, 10)).message,
    ).toMatch(/array of events/);
  });
});

describe("external forecast rows", () => {
  const base = {
    issueTime: "2031-05-01T00:30Z",
    level: "M+",
    window: "24",
    probability: "0.35",
    region: "",
  };

  it("reads levels, windows and probabilities in the usual spellings", () => {
    expect(checkExternalValues(base).record).toEqual({
      issueTime: new Date("2031-05-01T00:30:00Z"),
      regionNumber: null,
      level: "M+",
      windowHours: 24,
      probability: 0.35,
    });
    const alt = checkExternalValues({
      ...base,
      level: "x",
      window: "72h",
      probability: "5%",
      region: "hr-0412",
    }).record;
    expect(alt).toMatchObject({
      level: "X",
      windowHours: 72,
      probability: 0.05,
      regionNumber: "HR-0412",
    });
  });

  it("refuses a probability above 1, an unknown level or window, and a local time", () => {
    const { record, errors } = checkExternalValues({
      ...base,
      probability: "35",
      level: "B+",
      window: "12",
      issueTime: "2031-05-01T02:30+02:00",
    });
    expect(record).toBeNull();
    expect(Object.keys(errors).sort()).toEqual(["issueTime", "level", "probability", "window"]);
    expect(errors.probability).toMatch(/outside 0–1/);
  });

  it("refuses a second row for the same case, but not for another window", () => {
    const rows = checkExternalRows([
      base,
      { ...base, probability: "0.4" },
      { ...base, window: "48" },
    ]);
    expect(rows.map((r) => r.record === null)).toEqual([false, true, false]);
    expect(rows[1]?.errors.row).toMatch(/Row 1 already forecasts/);
  });
});

describe("upload preview", () => {
  it("counts every row and lists problems first", () => {
    const rows = [
      { row: 1, values: { a: "1" }, errors: {}, isDuplicate: false, note: null, timeMs: 2000 },
      {
        row: 2,
        values: { a: "2" },
        errors: { a: "bad", b: undefined },
        isDuplicate: false,
        note: null,
        timeMs: null,
      },
      {
        row: 3,
        values: { a: "3" },
        errors: { row: "dup" },
        isDuplicate: true,
        note: null,
        timeMs: 1000,
      },
    ];
    const preview = buildUploadPreview(rows);
    expect(preview.counts).toEqual({ rows: 3, valid: 1, withErrors: 1, duplicates: 1 });
    expect(preview.rows.map((r) => r.row)).toEqual([2, 3, 1]);
    expect(preview.rows[0]?.errors).toEqual({ a: "bad" });
    expect(preview.period).toEqual({
      first: new Date(1000).toISOString(),
      last: new Date(2000).toISOString(),
    });
    expect(preview.isTruncated).toBe(false);
  });
});
